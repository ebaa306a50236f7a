/**
 * Jump scopes
 * ===========
 * What `break`, `continue`, `return` and `throw` can leave while the builder is inside a
 * statement: loops, switches, labelled statements, the protected part of a `try` with a
 * `catch`, and everything a `finally` guards.
 */

/** Where a jump goes: pending edges collected until the target's block exists. */
export interface JumpTarget {
  edges: number[];
  /** Scope depth when the target was made; a jump crosses every `finally` scope at or above it. */
  depth: number;
}

/** A jump held by a `finally` scope until the finally block is built. */
export interface HeldJump {
  edges: number[];
  target: JumpTarget;
}

export type FlowScope =
  | { kind: 'loop'; labels: readonly string[]; breakTarget: JumpTarget; continueTarget: JumpTarget }
  | { kind: 'switch'; breakTarget: JumpTarget }
  | { kind: 'label'; labels: readonly string[]; breakTarget: JumpTarget }
  | { kind: 'catch'; target: JumpTarget }
  | { kind: 'finally'; held: HeldJump[] };
