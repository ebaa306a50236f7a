/**
 * A basis path as a test checklist
 * ================================
 * One readable line per decision the path passes, in order, e.g.
 * `line 12: if (order.isExpress) → true`, `line 30: case 'air' → does not match`,
 * `line 41: while (queue.length > 0) → enter loop`, `line 52: try … catch (e) → throws`,
 * `line 60: order.isExpress && order.paid, left side → falsy`.
 * The words follow the flow graph's outcome labels: loop tests "enter loop" / "leave loop" (a
 * do-while's test "loop again" / "leave loop"); `case` "matches" / "does not match"; `catch`
 * "throws" / "completes"; `&&`, `||`, `&&=`, `||=` test their left side for truthy / falsy;
 * `??`, `??=` and `?.` for "null or undefined" / "has a value"; a default value is "used" when
 * the value is undefined. The condition text is shown as the builder recorded it; a keyword it
 * already carries (`case 'air'`, `for (const x of xs)`, `catch (e)`) is not repeated.
 *
 * [Reference]: A. H. Watson & T. J. McCabe, NIST SP 500-235 (1996), §6 (each basis path is a
 * test case defined by the outcomes it takes).
 */
import type { Decision, DecisionKind, FlowGraph, Outcome } from '../model';

const LOOP: [string, string] = ['enter loop', 'leave loop'];
const TRUTH: [string, string] = ['true', 'false'];
const TRUTHY: [string, string] = ['truthy', 'falsy'];
const NULLISH: [string, string] = ['null or undefined', 'has a value'];

/** How each kind shows its condition (`%` stands for the text) and names its true / false outcome. */
const WORDING: Record<DecisionKind, [shape: string, outcomes: [string, string]]> = {
  if: ['if (%)', TRUTH],
  conditional: ['% ? … : …', TRUTH],
  case: ['case %', ['matches', 'does not match']],
  for: ['for (%)', LOOP],
  'for-in': ['for (%)', LOOP],
  'for-of': ['for (%)', LOOP],
  while: ['while (%)', LOOP],
  'do-while': ['do … while (%)', ['loop again', 'leave loop']],
  catch: ['try … catch (%)', ['throws', 'completes']],
  and: ['%, left side', TRUTHY],
  or: ['%, left side', TRUTHY],
  'and-assign': ['%, left side', TRUTHY],
  'or-assign': ['%, left side', TRUTHY],
  nullish: ['%, left side', NULLISH],
  'nullish-assign': ['%, left side', NULLISH],
  'optional-chain': ['%, value before ?.', NULLISH],
  'default-value': ['%, default value', ['used', 'not used']],
};

/** One checklist line per decision outcome the path takes. */
export function describePath(graph: FlowGraph, path: { steps: readonly { decision: number; outcome: Outcome }[] }): string[] {
  const byId = new Map<number, Decision>(graph.decisions.map((d) => [d.id, d]));
  return path.steps.map(({ decision, outcome }) => {
    const d = byId.get(decision);
    if (!d) throw new RangeError(`analyzer/paths: decision ${decision} is not in the graph`);
    const [shape, words] = WORDING[d.kind];
    return `line ${d.span.line}: ${condition(shape, d.text.trim())} → ${outcome === 'true' ? words[0] : words[1]}`;
  });
}

function condition(shape: string, text: string): string {
  if (text === '') return shape.replace(/,? ?\(?%\)?,? ?/, ' ').trim();
  const keyword = /([a-z]+) \(?%\)?$/.exec(shape);
  if (keyword && new RegExp(`^${keyword[1]}\\b`).test(text)) return shape.slice(0, keyword.index) + text;
  return shape.replace('%', text);
}
