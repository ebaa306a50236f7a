import type { CompactDecision, DecisionKind, Outcome } from './flow-types';

const LOOP: [string, string] = ['enter', 'leave'];
const TRUTH: [string, string] = ['true', 'false'];
const TRUTHY: [string, string] = ['truthy', 'falsy'];
const NULLISH: [string, string] = ['nullish', 'has value'];

/** Short outcome words per decision kind, for edge labels: [true outcome, false outcome]. */
const OUTCOME_WORDS: Record<DecisionKind, [string, string]> = {
  if: TRUTH,
  conditional: TRUTH,
  case: ['matches', 'no match'],
  for: LOOP,
  'for-in': LOOP,
  'for-of': LOOP,
  while: LOOP,
  'do-while': ['again', 'leave'],
  catch: ['throws', 'completes'],
  and: TRUTHY,
  or: TRUTHY,
  'and-assign': TRUTHY,
  'or-assign': TRUTHY,
  nullish: NULLISH,
  'nullish-assign': NULLISH,
  'optional-chain': NULLISH,
  'default-value': ['used', 'not used'],
};

/** What the kind is called in a sentence ("an `if`", "a `&&` operand"). */
const KIND_NAMES: Record<DecisionKind, string> = {
  if: 'if',
  conditional: 'conditional ?:',
  case: 'case',
  for: 'for loop',
  'for-in': 'for…in loop',
  'for-of': 'for…of loop',
  while: 'while loop',
  'do-while': 'do…while loop',
  catch: 'catch',
  and: '&& operator',
  or: '|| operator',
  'and-assign': '&&= assignment',
  'or-assign': '||= assignment',
  nullish: '?? operator',
  'nullish-assign': '??= assignment',
  'optional-chain': 'optional chain ?.',
  'default-value': 'default value',
};

/** A short tag for a decision block, beside its line: "if", "&&", "while"… */
const KIND_TAGS: Record<DecisionKind, string> = {
  if: 'if',
  conditional: '?:',
  case: 'case',
  for: 'for',
  'for-in': 'for…in',
  'for-of': 'for…of',
  while: 'while',
  'do-while': 'do…while',
  catch: 'catch',
  and: '&& left side',
  or: '|| left side',
  'and-assign': '&&= left side',
  'or-assign': '||= left side',
  nullish: '?? left side',
  'nullish-assign': '??= left side',
  'optional-chain': '?.',
  'default-value': 'default',
};

/** The short tag of a decision kind, e.g. "&& left side". */
export function kindTag(kind: DecisionKind): string {
  return KIND_TAGS[kind];
}

/** The word on an edge leaving a decision of `kind` with `outcome`. */
export function outcomeWord(kind: DecisionKind, outcome: Outcome): string {
  const [whenTrue, whenFalse] = OUTCOME_WORDS[kind];
  return outcome === 'true' ? whenTrue : whenFalse;
}

/** The name of a decision kind, e.g. "while loop". */
export function kindName(kind: DecisionKind): string {
  return KIND_NAMES[kind];
}

/** One line naming a decision: `line 30: if — order.isExpress`. */
export function decisionSummary(decision: CompactDecision): string {
  return `line ${decision.span.line}: ${kindName(decision.kind)} — ${decision.text}`;
}
