/**
 * Switch
 * ======
 * Each non-default `case` is a binary test "matches?" made in source order; a test that does not
 * match falls to the next test; when no test matches, control goes to `default` wherever it is
 * placed, or past the switch. Bodies follow in source order and fall through from one clause
 * into the next; `break` leaves the switch.
 *
 *   switch (x) { case 1: A; case 2: B; break; default: C }
 *
 *   [x]──▶[case 1]──f──▶[case 2]──f──┐
 *            │t           │t         │ (no match)
 *            ▼            ▼          ▼
 *           [A]──────────▶[B]──┐    [C]──▶ after
 *                              └─(break)──▶ after
 *
 * `--switch one` does not change the graph: the reported V(G) subtracts (cases − 1) per switch.
 *
 * [Reference]: Watson & McCabe, NIST SP 500-235 §4: each `case` label adds 1, `default` adds nothing.
 */
import { ts } from '../compiler';
import type { FlowBuilder } from './FlowBuilder';

const K = ts.SyntaxKind;

export function buildSwitch(b: FlowBuilder, node: ts.SwitchStatement): void {
  b.value(node.expression);
  b.w.emitNode(node.expression);
  const switchIndex = b.switchCount++;
  const clauses = node.caseBlock.clauses;
  const entries: number[][] = [];
  let defaultClause = -1;
  for (let i = 0; i < clauses.length; i++) {
    const clause = clauses[i];
    entries.push([]);
    if (clause.kind === K.DefaultClause) {
      defaultClause = i;
      continue;
    }
    b.value(clause.expression);
    const start = clause.getStart(b.sourceFile);
    const d = b.decisionAt('case', start, clause.expression.end, switchIndex);
    const noMatch: number[] = [];
    b.w.decide(d, start, clause.expression.end, entries[i], noMatch);
    b.w.merge(noMatch);
  }
  const breakTarget = b.newTarget();
  const noMatch = b.w.take();
  if (defaultClause >= 0) entries[defaultClause] = noMatch;
  else for (const e of noMatch) breakTarget.edges.push(e);
  b.pushScope({ kind: 'switch', breakTarget });
  for (let i = 0; i < clauses.length; i++) {
    b.w.merge(entries[i]);
    b.statements(clauses[i].statements);
  }
  b.popScope();
  b.w.merge(breakTarget.edges);
}
