/**
 * Covered decision outcomes
 * =========================
 * Maps a coverage report onto one unit's decisions: for each decision, whether its `true`
 * and its `false` outcome ran. An outcome is covered when the report counts it > 0.
 *
 * Branch records (Istanbul types; lcov gives none, so the number of outcomes stands in):
 * - `if` / `conditional` ← `if` / `cond-expr` (2 outcomes): [then > 0, else > 0].
 * - `and` / `or` / `nullish` ← `binary-expr`, one count per operand of the whole
 *   `a && b || c` tree (Istanbul flattens nested operators, parentheses too). Operator k (in
 *   source order) sits between operands k and k+1: it continued (ran its right side) when
 *   operand k+1 ran, and it short-circuited when it was tested more often than that. The graph
 *   tests `&&` / `||` on the operand just before them (operand k's count), but `??`, and an
 *   `&&` / `||` whose left side is a `??`, on the value of the whole left side (its first
 *   operand's count). Continuing is `true` for `&&` and `??` (`??` tests "left is null or
 *   undefined") and `false` for `||`. Exact for chains of one operator; in a mixed tree an
 *   operand can also be reached from an earlier operator's short-circuit, which counts for
 *   the continuing operator here.
 * - `case` ← `switch`, one count per clause (default included). Case i matched when its
 *   clause count > 0; it did not match when a later case or the default ran, or — without a
 *   default — when the switch line ran more often than all clauses together. Istanbul counts
 *   a clause also when control falls through into it, which these rules cannot undo.
 * - `default-value` ← `default-arg` (1 count: the default was used): [used > 0, evaluated
 *   more often than used], evaluations = the function's calls for a default on its first
 *   line, else the line's hits.
 * Decisions sharing a line are matched to the line's records in order of appearance: ours
 * in source pre-order (start, then the longer span first, as the instrumenter walks), the
 * report's in its own order. A `binary-expr` record takes the first unmatched operator and
 * as many following ones as it has operators. A switch takes the nearest fitting record at
 * or above its first case.
 *
 * Without a branch record, line hits decide (a line shared with the decision itself says
 * nothing, since its count mixes both outcomes):
 * - loops: `true` when the body ran; `false` when the code after the loop ran (a loop that
 *   ends the function counts as left whenever it ran). So a loop whose body ran and whose
 *   exit was reached is covered both ways.
 * - `catch` (decided before the try block: false = the try block runs and completes): `true`
 *   when the handler ran; `false` when the try block ran more often than the handler, since
 *   every run of the try block either completes or throws into the handler.
 * - anything else (logical assignments, optional chains, records missing): an outcome is
 *   covered when the first counted line control reaches from its target ran.
 */
import type { Decision, DecisionKind, Outcome, SourceSpan } from '../model';
import type { BranchRecord } from './CoverageReport';
import type { UnitHits } from './UnitHits';

const LOOPS: ReadonlySet<DecisionKind> = new Set(['for', 'for-in', 'for-of', 'while', 'do-while']);
const LOGICAL: ReadonlySet<DecisionKind> = new Set(['and', 'or', 'nullish']);

/**
 * Which outcome of a short-circuit operator goes on to evaluate its right operand: `&&` tests
 * "left truthy", `||` the same (so it continues on false), `??` tests "left null or undefined".
 */
export function continuingOutcome(kind: DecisionKind): Outcome {
  return kind === 'or' || kind === 'or-assign' ? 'false' : 'true';
}

/** Per decision (graph.decisions order): [true covered, false covered]. `calls`: how often the unit was entered, when known. */
export function coveredOutcomes(hits: UnitHits, ran: boolean, calls?: number): [boolean, boolean][] {
  const decisions = hits.graph.decisions;
  const result: ([boolean, boolean] | undefined)[] = decisions.map(() => undefined);
  if (!ran) return decisions.map(() => [false, false]);
  const used = new Set<BranchRecord>();
  matchSwitches(hits, result, used);
  matchByLine(hits, result, used, calls);
  decisions.forEach((d, i) => {
    if (result[i]) return;
    if (LOOPS.has(d.kind)) result[i] = loopOutcomes(hits, d);
    else if (d.kind === 'catch') result[i] = catchOutcomes(hits, d);
    else result[i] = [reachedElsewhere(hits, d, 'true'), reachedElsewhere(hits, d, 'false')];
  });
  return result.map((r) => r ?? [false, false]);
}

function matchSwitches(hits: UnitHits, result: ([boolean, boolean] | undefined)[], used: Set<BranchRecord>): void {
  const groups = new Map<number, number[]>();
  hits.graph.decisions.forEach((d, i) => {
    if (d.kind !== 'case') return;
    const key = d.switchIndex ?? -1;
    groups.set(key, [...(groups.get(key) ?? []), i]);
  });
  for (const members of groups.values()) {
    const cases = members.sort((a, b) => comparePosition(hits.graph.decisions[a], hits.graph.decisions[b]));
    const n = cases.length;
    const firstLine = hits.graph.decisions[cases[0]].span.line;
    let record: BranchRecord | undefined;
    for (const r of hits.branches) {
      const fits = (r.type === 'switch' || r.type === undefined) && (r.counts.length === n || r.counts.length === n + 1);
      if (!used.has(r) && fits && r.line <= firstLine && (!record || r.line > record.line)) record = r;
    }
    if (!record) continue;
    used.add(record);
    const caseLines = cases.map((i) => hits.graph.decisions[i].span.line);
    const { slots, defaultSlot } = clauseSlots(record, caseLines);
    const counts = record.counts.map((c) => c ?? 0);
    const clausesTotal = counts.reduce((a, b) => a + b, 0);
    const switchHits = hits.hitsOn(record.line);
    const noMatch = defaultSlot < 0 && switchHits !== undefined && switchHits > clausesTotal;
    cases.forEach((decision, k) => {
      const matched = counts[slots[k]] > 0;
      const laterRan = slots.slice(k + 1).some((s) => counts[s] > 0) || (defaultSlot >= 0 && counts[defaultSlot] > 0) || noMatch;
      result[decision] = [matched, laterRan];
    });
  }
}

/** Which report outcome each of our cases is, and which one is the default (−1: none). */
function clauseSlots(record: BranchRecord, caseLines: number[]): { slots: number[]; defaultSlot: number } {
  const n = caseLines.length;
  if (record.counts.length === n) return { slots: caseLines.map((_, k) => k), defaultSlot: -1 };
  // One clause more than our cases: the default. Istanbul's clause places find it; lcov has
  // none, and the default is then taken to be last, where it usually is.
  const places = record.locations;
  if (places && places.length === n + 1) {
    const slots: number[] = [];
    let defaultSlot = -1;
    for (let s = 0, k = 0; s < places.length; s++) {
      if (k < n && places[s]?.line === caseLines[k]) slots.push(s), k++;
      else if (defaultSlot < 0) defaultSlot = s;
      else break;
    }
    if (slots.length === n && defaultSlot >= 0) return { slots, defaultSlot };
  }
  return { slots: caseLines.map((_, k) => k), defaultSlot: n };
}

function matchByLine(hits: UnitHits, result: ([boolean, boolean] | undefined)[], used: Set<BranchRecord>, calls?: number): void {
  const decisions = hits.graph.decisions;
  const order = decisions.map((_, i) => i).filter((i) => decisions[i].kind !== 'case');
  order.sort((a, b) => comparePosition(decisions[a], decisions[b]));
  const take = (line: number, fits: (r: BranchRecord) => boolean): BranchRecord | undefined => {
    const r = hits.branches.find((b) => !used.has(b) && b.line === line && fits(b));
    if (r) used.add(r);
    return r;
  };
  order.forEach((i, position) => {
    const d = decisions[i];
    if (result[i]) return;
    if (d.kind === 'if' || d.kind === 'conditional') {
      const r = take(d.span.line, (b) => b.type === 'if' || b.type === 'cond-expr' || (b.type === undefined && b.counts.length === 2));
      if (r) result[i] = [(r.counts[0] ?? 0) > 0, (r.counts[1] ?? 0) > 0];
    } else if (d.kind === 'default-value') {
      const r = take(d.span.line, (b) => b.type === 'default-arg' || (b.type === undefined && b.counts.length === 1));
      if (!r) return;
      const usedCount = r.counts[0] ?? 0;
      const evaluations = (d.span.line === hits.range.line ? calls : undefined) ?? hits.hitsOn(d.span.line) ?? 0;
      result[i] = [usedCount > 0, evaluations > usedCount];
    } else if (LOGICAL.has(d.kind)) {
      const r = take(d.span.line, (b) => b.type === 'binary-expr' || (b.type === undefined && b.counts.length >= 2));
      if (!r) return;
      const group = [i];
      for (let p = position + 1; p < order.length && group.length < r.counts.length - 1; p++) {
        const j = order[p];
        if (!result[j] && LOGICAL.has(decisions[j].kind)) group.push(j);
      }
      const counts = r.counts.map((c) => c ?? 0);
      operandOutcomes(group.map((j) => decisions[j]), counts).forEach((o, k) => (result[group[k]] = o));
    }
  });
}

/**
 * Outcomes of the operators of one `binary-expr` record from its per-operand counts. Operator k
 * (source order) continued when operand k+1 ran. How often it was tested depends on what the
 * graph tests: `&&` / `||` over a plain operand or another `&&` / `||` test the operand just
 * before them (operand k); `??`, and `&&` / `||` over a `??`, test the value of their whole
 * left side, which ran as often as its first operand. Short-circuited = tested > continued.
 */
function operandOutcomes(group: Decision[], counts: number[]): [boolean, boolean][] {
  const ops = [...group].sort(compareEnd);
  const result = new Map<Decision, [boolean, boolean]>();
  const andOr = (d: Decision) => d.kind === 'and' || d.kind === 'or';
  ops.forEach((d, k) => {
    const inside = ops.filter((o) => o !== d && !before(o.span, d.span) && !after(o.span, d.span)).sort(comparePosition);
    const firstOperand = ops.filter((o) => endsBy(o.span, d.span.line, d.span.column)).length;
    const tested = andOr(d) && (inside.length === 0 || andOr(inside[0])) ? counts[k] : counts[firstOperand];
    const continued = counts[k + 1] ?? 0;
    const shortCircuited = (tested ?? 0) > continued;
    result.set(d, continuingOutcome(d.kind) === 'true' ? [continued > 0, shortCircuited] : [shortCircuited, continued > 0]);
  });
  return group.map((d) => result.get(d)!);
}

/** Whether span `o` ends at or before line:column. */
function endsBy(o: SourceSpan, line: number, column: number): boolean {
  return o.endLine < line || (o.endLine === line && o.endColumn <= column);
}

/** Whether `o` lies wholly before `d` starts. */
function before(o: SourceSpan, d: SourceSpan): boolean {
  return endsBy(o, d.line, d.column);
}

/** Whether `o` ends after `d` ends (so it is not inside `d`). */
function after(o: SourceSpan, d: SourceSpan): boolean {
  return o.endLine > d.endLine || (o.endLine === d.endLine && o.endColumn > d.endColumn);
}

function loopOutcomes(hits: UnitHits, d: Decision): [boolean, boolean] {
  const body = reachOf(hits, d, 'true');
  const bodyRan = ranElsewhere(body);
  const after = reachOf(hits, d, 'false');
  if (after === 'exit') return [bodyRan, bodyRan || (hits.hitsOn(d.span.line) ?? 0) > 0];
  return [bodyRan, ranElsewhere(after)];
}

function catchOutcomes(hits: UnitHits, d: Decision): [boolean, boolean] {
  // Every run of the try block either completes or throws into the handler, so
  // completions = try entries − handler runs.
  const handler = reachOf(hits, d, 'true');
  const tryBlock = reachOf(hits, d, 'false');
  const handlerRuns = typeof handler === 'object' ? handler.hits : 0;
  const tryRuns = typeof tryBlock === 'object' && tryBlock.line !== (typeof handler === 'object' ? handler.line : -1) ? tryBlock.hits : 0;
  return [handlerRuns > 0, tryRuns > handlerRuns];
}

function reachedElsewhere(hits: UnitHits, d: Decision, outcome: Outcome): boolean {
  return ranElsewhere(reachOf(hits, d, outcome));
}

function reachOf(hits: UnitHits, d: Decision, outcome: Outcome): ReturnType<UnitHits['reach']> {
  const target = hits.target(d.id, outcome);
  return target === undefined ? undefined : hits.reach(target, d.span.line);
}

function ranElsewhere(reach: ReturnType<UnitHits['reach']>): boolean {
  return typeof reach === 'object' && reach.hits > 0;
}

/** Source pre-order: by start; at the same start the longer span (the enclosing construct) first. */
function comparePosition(a: Decision, b: Decision): number {
  return a.span.line - b.span.line || a.span.column - b.span.column || b.span.endLine - a.span.endLine || b.span.endColumn - a.span.endColumn || a.id - b.id;
}

/** Operator order: an operator follows its left operand, so the operand's end orders them. */
function compareEnd(a: Decision, b: Decision): number {
  return a.span.endLine - b.span.endLine || a.span.endColumn - b.span.endColumn || a.id - b.id;
}
