/**
 * Flow builder state
 * ==================
 * Holds what the per-construct builders share while one unit is walked: the graph writer,
 * the counting settings, the jump scopes and the switch counter. The construct builders live in
 * their own files (statements, loops, switch, try, conditions, values, patterns) and reach each
 * other through the dispatch methods here, so no file imports another at run time in a cycle.
 */
import { ts } from '../compiler';
import type { CountingSettings } from '../model/CountingSettings';
import type { DecisionKind, FlowGraph } from '../model/FlowGraph';
import { buildCondition } from './buildCondition';
import { buildValue } from './buildValue';
import { buildAssignmentPattern, buildBindingPattern, buildDefaultValue } from './buildPatterns';
import { buildStatement } from './buildStatement';
import { FlowGraphError } from './FlowGraphError';
import type { FlowScope, JumpTarget } from './FlowScope';
import { GraphWriter } from './GraphWriter';
import { collapsedText } from './sourceSpan';

export class FlowBuilder {
  readonly w: GraphWriter;
  readonly text: string;
  /** Where `return` (and an uncaught `throw`) goes: the exit block. */
  readonly exitTarget: JumpTarget = { edges: [], depth: 0 };
  /** Number of switch statements met so far (source order, pre-order). */
  switchCount = 0;
  /** Bound once: `ts.forEachChild` callback that builds each child as a value. */
  readonly visitValue = (node: ts.Node): undefined => {
    buildValue(this, node);
    return undefined;
  };
  private readonly scopes: FlowScope[] = [];

  constructor(
    readonly sourceFile: ts.SourceFile,
    readonly settings: CountingSettings,
  ) {
    this.w = new GraphWriter(sourceFile);
    this.text = sourceFile.text;
  }

  statement(node: ts.Statement): void {
    buildStatement(this, node);
  }

  statements(nodes: readonly ts.Statement[]): void {
    for (const node of nodes) buildStatement(this, node);
  }

  value(node: ts.Node): void {
    buildValue(this, node);
  }

  condition(node: ts.Expression, onTrue: number[], onFalse: number[], owner: number, negated = false): void {
    buildCondition(this, node, onTrue, onFalse, owner, negated);
  }

  defaultValue(element: ts.Node, initializer: ts.Expression): void {
    buildDefaultValue(this, element, initializer);
  }

  bindingPattern(pattern: ts.BindingPattern): void {
    buildBindingPattern(this, pattern);
  }

  assignmentPattern(pattern: ts.ObjectLiteralExpression | ts.ArrayLiteralExpression): void {
    buildAssignmentPattern(this, pattern);
  }

  /** Registers a decision whose span is `spanNode` and whose text is `textNode`'s source. */
  decision(kind: DecisionKind, spanNode: ts.Node, textNode: ts.Node = spanNode, switchIndex = -1): number {
    const start = spanNode.getStart(this.sourceFile);
    const textStart = textNode === spanNode ? start : textNode.getStart(this.sourceFile);
    return this.w.addDecision(kind, start, spanNode.end, collapsedText(this.text, textStart, textNode.end), switchIndex);
  }

  /** Registers a decision on the source range `[start, end)` (loop heads, case labels, catch clauses). */
  decisionAt(kind: DecisionKind, start: number, end: number, switchIndex = -1): number {
    return this.w.addDecision(kind, start, end, collapsedText(this.text, start, end), switchIndex);
  }

  /** Creates the decision block testing `node` (see `GraphWriter.decide`). */
  decideNode(decision: number, node: ts.Node, onTrue: number[], onFalse: number[], negated = false): number {
    return this.w.decide(decision, node.getStart(this.sourceFile), node.end, onTrue, onFalse, negated);
  }

  newTarget(): JumpTarget {
    return { edges: [], depth: this.scopes.length };
  }

  pushScope(scope: FlowScope): void {
    this.scopes.push(scope);
  }

  popScope(): FlowScope {
    const scope = this.scopes.pop();
    if (!scope) throw new FlowGraphError('scope stack underflow');
    return scope;
  }

  /** Sends the frontier to `target`; control is dead afterwards. */
  jump(target: JumpTarget): void {
    this.route(this.w.take(), target);
  }

  /** Sends edges to `target`, or hands them to the innermost `finally` between here and the target. */
  route(edges: number[], target: JumpTarget): void {
    if (edges.length === 0) return;
    for (let i = this.scopes.length - 1; i >= target.depth; i--) {
      const scope = this.scopes[i];
      if (scope.kind === 'finally') {
        scope.held.push({ edges, target });
        return;
      }
    }
    for (const e of edges) target.edges.push(e);
  }

  /** Target of `break` / `break label`; the exit when nothing matches (code the parser already refused). */
  breakTarget(label: string | undefined): JumpTarget {
    for (let i = this.scopes.length - 1; i >= 0; i--) {
      const scope = this.scopes[i];
      if (label === undefined) {
        if (scope.kind === 'loop' || scope.kind === 'switch') return scope.breakTarget;
      } else if ((scope.kind === 'loop' || scope.kind === 'label') && scope.labels.includes(label)) {
        return scope.breakTarget;
      }
    }
    return this.exitTarget;
  }

  /** Target of `continue` / `continue label`. */
  continueTarget(label: string | undefined): JumpTarget {
    for (let i = this.scopes.length - 1; i >= 0; i--) {
      const scope = this.scopes[i];
      if (scope.kind === 'loop' && (label === undefined || scope.labels.includes(label))) return scope.continueTarget;
    }
    return this.exitTarget;
  }

  /** Target of `throw`: the innermost catch whose try block we are in, else the exit. */
  throwTarget(): JumpTarget {
    for (let i = this.scopes.length - 1; i >= 0; i--) {
      const scope = this.scopes[i];
      if (scope.kind === 'catch') return scope.target;
    }
    return this.exitTarget;
  }

  /** Finishes the graph: the frontier and every `return` go to the exit block. */
  finish(): FlowGraph {
    if (this.scopes.length > 0) throw new FlowGraphError('scopes left open');
    return this.w.finish(this.exitTarget.edges);
  }
}
