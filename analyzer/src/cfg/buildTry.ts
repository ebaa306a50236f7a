/**
 * Try / catch / finally
 * =====================
 * A `catch` is one decision placed at the start of the try: false = the try block runs and
 * completes, true = it throws and the catch body runs. An explicit `throw` inside the try block
 * also goes to the catch body. A try with `finally` but no `catch` adds no decision.
 *
 *   try { T } catch (e) { C } finally { F }
 *
 *   ──▶[catch?]──f──▶[T]──────────────┐
 *         │t          │ throw         ▼
 *         └──────────▶[C]──────────▶ [F] ──▶ one destination (see below)
 *
 * `finally` is built once. Every completion that leaves T or C (falling off the end, `return`,
 * `break`, `continue`, an uncaught `throw`) is held by the finally scope until F is built. F's
 * last block, like any other non-decision block, has exactly one out-edge, so F can lead to one
 * destination only:
 *   - the code after the try statement when T or C can complete normally; otherwise
 *   - the destination of the first held jump (e.g. the exit for `try { return x } finally {…}`).
 * Held jumps going to that destination pass through F; held jumps going elsewhere (a `break`
 * while the try also completes normally, say) go straight to their own target, or to the next
 * enclosing finally. So every completion ends up where it was going, F is never duplicated, and
 * no block gets an out-edge that no decision accounts for (V(G) = decisions + 1 still holds).
 * The price: in the graph such a jump skips F's statements. ESLint's complexity rule does not
 * count `finally` either (reference-checks §8).
 *
 *   while (c) { try { if (x) break; work() } finally { F } }
 *
 *   [c]──t──▶[x]──t──▶[break]────────────────▶ after the loop   (held, goes elsewhere: skips F)
 *    ▲        │f                                                 
 *    │        └──▶[work()]──▶[F]──┐                               (normal completion: through F)
 *    └────────────────────────────┘
 */
import { ts } from '../compiler';
import type { FlowBuilder } from './FlowBuilder';
import type { HeldJump, JumpTarget } from './FlowScope';

export function buildTry(b: FlowBuilder, node: ts.TryStatement): void {
  const guard = node.finallyBlock ? { kind: 'finally' as const, held: [] as HeldJump[] } : undefined;
  if (guard) b.pushScope(guard);
  const completed = node.catchClause ? buildTryCatch(b, node.tryBlock, node.catchClause) : tryBlockOnly(b, node.tryBlock);
  if (!guard || !node.finallyBlock) {
    b.w.merge(completed);
    return;
  }
  b.popScope();
  buildFinally(b, node.finallyBlock, completed, guard.held);
}

function tryBlockOnly(b: FlowBuilder, block: ts.Block): number[] {
  b.statement(block);
  return b.w.take();
}

/** Builds the catch decision, the try block and the catch body; returns their normal completions. */
function buildTryCatch(b: FlowBuilder, block: ts.Block, clause: ts.CatchClause): number[] {
  const start = clause.getStart(b.sourceFile);
  const d = b.decisionAt('catch', start, clause.block.pos);
  const catchTarget: JumpTarget = b.newTarget();
  const runs: number[] = [];
  b.w.decide(d, start, clause.block.pos, catchTarget.edges, runs);
  b.pushScope({ kind: 'catch', target: catchTarget });
  b.w.merge(runs);
  b.statement(block);
  const completed = b.w.take();
  b.popScope();
  b.w.merge(catchTarget.edges);
  const variable = clause.variableDeclaration;
  if (variable && variable.name.kind !== ts.SyntaxKind.Identifier) b.bindingPattern(variable.name as ts.BindingPattern);
  b.statement(clause.block);
  for (const e of b.w.take()) completed.push(e);
  return completed;
}

function buildFinally(b: FlowBuilder, block: ts.Block, completed: number[], held: HeldJump[]): void {
  // One destination for F's single out-edge: normal completion if any, else the first held jump.
  const destination: JumpTarget | undefined = completed.length > 0 ? undefined : held[0]?.target;
  b.w.merge(completed);
  for (const jump of held) {
    if (jump.target === destination) b.w.merge(jump.edges);
    else b.route(jump.edges, jump.target);
  }
  b.statement(block);
  if (destination) b.jump(destination);
}
