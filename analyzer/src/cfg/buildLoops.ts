/**
 * Loops
 * =====
 * Every loop head is one binary decision: true = run the body, false = leave. Constant tests are
 * not folded (`while (true)` keeps its false edge) and a missing test (`for (;;)`) is still a
 * decision, so V(G) = decisions + 1 holds for every loop.
 *
 *   while (c) S          for (i; c; u) S              do S while (c)         for (x of xs) S
 *   ──▶[c]──t──▶[S]      [i]──▶[c]──t──▶[S]──▶[u]     ──▶[S]──▶[c]──t──┐     [xs]──▶[of]──t──▶[x S]
 *       ▲ │f     │              ▲ │f              │        ▲          │f │               ▲ │f     │
 *       └─┼──────┘              └─┼───────────────┘        └──────────┼──┘               └─┼──────┘
 *         ▼ after                 ▼ after                             ▼ after               ▼ after
 *
 * `continue` goes to the test (while, for-in/of), to the update (for) or to the test after the
 * body (do-while); `break` to after the loop. Labels on a loop name it for `continue label`.
 *
 * [Reference]: McCabe 1976, IEEE TSE SE-2(4): while and repeat-until each have v = 2.
 */
import { ts } from '../compiler';
import type { FlowBuilder } from './FlowBuilder';
import { buildDeclarations } from './buildPatterns';
import type { JumpTarget } from './FlowScope';
import { isAssignmentPattern } from './unitBoundaries';

const K = ts.SyntaxKind;

function loopBody(b: FlowBuilder, body: ts.Statement, labels: readonly string[], breakTarget: JumpTarget): JumpTarget {
  const continueTarget = b.newTarget();
  b.pushScope({ kind: 'loop', labels, breakTarget, continueTarget });
  b.statement(body);
  b.popScope();
  return continueTarget;
}

export function buildWhile(b: FlowBuilder, node: ts.WhileStatement, labels: readonly string[]): void {
  const breakTarget = b.newTarget();
  const d = b.decision('while', node.expression);
  const head = b.w.mark();
  const enter: number[] = [];
  b.condition(node.expression, enter, breakTarget.edges, d);
  b.w.merge(enter);
  const continueTarget = loopBody(b, node.statement, labels, breakTarget);
  b.w.merge(continueTarget.edges);
  b.w.connect(b.w.take(), head);
  b.w.merge(breakTarget.edges);
}

export function buildDoWhile(b: FlowBuilder, node: ts.DoStatement, labels: readonly string[]): void {
  const breakTarget = b.newTarget();
  b.w.seal();
  const start = b.w.openBlock();
  const continueTarget = loopBody(b, node.statement, labels, breakTarget);
  b.w.merge(continueTarget.edges);
  const d = b.decision('do-while', node.expression);
  const again: number[] = [];
  b.condition(node.expression, again, breakTarget.edges, d);
  b.w.connect(again, start);
  b.w.merge(breakTarget.edges);
}

export function buildFor(b: FlowBuilder, node: ts.ForStatement, labels: readonly string[]): void {
  const init = node.initializer;
  if (init) {
    if (init.kind === K.VariableDeclarationList) buildDeclarations(b, init as ts.VariableDeclarationList);
    else b.value(init);
    b.w.emitNode(init);
  }
  const breakTarget = b.newTarget();
  const head = b.w.mark();
  const enter: number[] = [];
  if (node.condition) {
    b.condition(node.condition, enter, breakTarget.edges, b.decision('for', node.condition));
  } else {
    const start = node.getStart(b.sourceFile);
    const d = b.decisionAt('for', start, node.statement.pos);
    b.w.decide(d, start, node.statement.pos, enter, breakTarget.edges);
  }
  b.w.merge(enter);
  const continueTarget = loopBody(b, node.statement, labels, breakTarget);
  b.w.merge(continueTarget.edges);
  if (node.incrementor) {
    b.value(node.incrementor);
    b.w.emitNode(node.incrementor);
  }
  b.w.connect(b.w.take(), head);
  b.w.merge(breakTarget.edges);
}

export function buildForInOf(b: FlowBuilder, node: ts.ForInStatement | ts.ForOfStatement, labels: readonly string[]): void {
  b.value(node.expression);
  b.w.emitNode(node.expression);
  const breakTarget = b.newTarget();
  const start = node.getStart(b.sourceFile);
  const d = b.decisionAt(node.kind === K.ForOfStatement ? 'for-of' : 'for-in', start, node.statement.pos);
  const enter: number[] = [];
  const head = b.w.decide(d, start, node.statement.pos, enter, breakTarget.edges);
  b.w.merge(enter);
  const init = node.initializer;
  if (init.kind === K.VariableDeclarationList) buildDeclarations(b, init as ts.VariableDeclarationList);
  else if (isAssignmentPattern(init)) b.assignmentPattern(init);
  else b.value(init);
  b.w.emitNode(init);
  const continueTarget = loopBody(b, node.statement, labels, breakTarget);
  b.w.merge(continueTarget.edges);
  b.w.connect(b.w.take(), head);
  b.w.merge(breakTarget.edges);
}
