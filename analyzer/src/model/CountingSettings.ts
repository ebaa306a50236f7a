/**
 * Counting settings
 * =================
 * Which constructs count as decisions. The defaults follow McCabe's strict rules: every
 * condition of a compound predicate counts (&&, ||, ?? and the logical assignments), every
 * non-default `case` counts, and constructs McCabe's papers do not name (optional chaining,
 * default values) do not. The settings travel with every snapshot so numbers can be compared.
 */
export interface CountingSettings {
  /** `cases`: each non-default case is a decision; `one`: a switch is reported as one decision. */
  switch: 'cases' | 'one';
  /** Whether each `?.` (member access or call) is a decision with its own branch in the graph. */
  optionalChaining: boolean;
  /** Whether each default value (parameter or destructuring) is a decision with its own branch. */
  defaultValues: boolean;
  /** V(G) above this is "over the limit" (McCabe 1976: 10 is "a reasonable, but not magical, upper limit"). */
  limit: number;
}

/** McCabe's strict rules and the published limit of 10. */
export const DEFAULT_SETTINGS: Readonly<CountingSettings> = Object.freeze({
  switch: 'cases',
  optionalChaining: false,
  defaultValues: false,
  limit: 10,
});

/** The settings under which our V(G) is comparable with ESLint's `complexity` rule (classic variant). */
export const ESLINT_COMPARABLE_SETTINGS: Readonly<CountingSettings> = Object.freeze({
  switch: 'cases',
  optionalChaining: true,
  defaultValues: true,
  limit: 10,
});
