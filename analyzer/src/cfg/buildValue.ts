/**
 * Expressions evaluated for their value
 * =====================================
 * Walks an expression in evaluation order and builds the branches hidden inside it:
 * `&&` / `||` (the left operand is built as a condition, so `a && b && c` short-circuits
 * straight past every remaining operand), `??`, the logical assignments `&&=` / `||=` / `??=`,
 * `?:`, each `?.` of an optional chain (only with `optionalChaining`; a nullish object skips to
 * the end of the whole chain), and destructuring assignments (defaults only with `defaultValues`).
 * The evaluated operand of each branch gets its own code block, so no branch is an empty edge.
 *
 * Outcome labels: `&&`, `||`, `&&=`, `||=`: true = the left operand is truthy; `??`, `??=`, `?.`:
 * true = the tested value is null or undefined (the right operand runs / the chain stops).
 *
 * Edge cases: left-deep operator chains (`a + b + … `, `a ?? b ?? …`) and member/call chains
 * (`a.b().c()…`) are walked along their left spine with a loop, not recursion, so thousands of
 * terms cannot overflow the stack. Nested units are not entered (see unitBoundaries.ts).
 *
 * [Reference]: McCabe 1976, IEEE TSE SE-2(4) (each condition of a compound predicate is a
 * predicate); Watson & McCabe, NIST SP 500-235 §4 (short-circuit operators are hidden decisions).
 */
import { ts } from '../compiler';
import type { DecisionKind } from '../model/FlowGraph';
import type { FlowBuilder } from './FlowBuilder';
import { forEachClassPart, forEachParentPart, isAssignmentPattern, isTypeOrAmbient, isUnitBoundary } from './unitBoundaries';

const K = ts.SyntaxKind;
// Read once: each `ts.` member is a getter on the compiler's module object, and this runs per node.
const forEachChild = ts.forEachChild;

/** Builds `node` as a value (see file header). */
export function buildValue(b: FlowBuilder, node: ts.Node): void {
  switch (node.kind) {
    case K.Identifier:
    case K.StringLiteral:
    case K.NumericLiteral:
    case K.ThisKeyword:
    case K.TrueKeyword:
    case K.FalseKeyword:
    case K.NullKeyword:
      return;
    case K.BinaryExpression:
      buildBinary(b, node as ts.BinaryExpression);
      return;
    case K.PropertyAccessExpression:
    case K.ElementAccessExpression:
    case K.CallExpression:
    case K.NonNullExpression:
      buildAccessChain(b, node as ChainLink);
      return;
    case K.ConditionalExpression:
      buildConditional(b, node as ts.ConditionalExpression);
      return;
    case K.ClassExpression:
    case K.ClassDeclaration:
      forEachClassPart(node as ts.ClassLikeDeclaration, b.visitValue);
      return;
    default:
      if (isUnitBoundary(node)) forEachParentPart(node, b.visitValue);
      else if (!isTypeOrAmbient(node)) forEachChild(node, b.visitValue);
  }
}

/** The decision kind of a short-circuit operator token, or undefined for any other operator. */
export function shortCircuitKind(operator: ts.SyntaxKind): DecisionKind | undefined {
  switch (operator) {
    case K.AmpersandAmpersandToken:
      return 'and';
    case K.BarBarToken:
      return 'or';
    case K.QuestionQuestionToken:
      return 'nullish';
    case K.AmpersandAmpersandEqualsToken:
      return 'and-assign';
    case K.BarBarEqualsToken:
      return 'or-assign';
    case K.QuestionQuestionEqualsToken:
      return 'nullish-assign';
    default:
      return undefined;
  }
}

function isPlainBinary(node: ts.Node): node is ts.BinaryExpression {
  if (node.kind !== K.BinaryExpression) return false;
  const e = node as ts.BinaryExpression;
  const op = e.operatorToken.kind;
  return shortCircuitKind(op) === undefined && !(op === K.EqualsToken && isAssignmentPattern(e.left));
}

function buildBinary(b: FlowBuilder, node: ts.BinaryExpression): void {
  const kind = shortCircuitKind(node.operatorToken.kind);
  if (kind === 'and' || kind === 'or') return buildLogical(b, node, kind);
  if (kind === 'nullish') return buildNullishChain(b, node);
  if (kind !== undefined) return buildLogicalAssignment(b, node, kind);
  if (node.operatorToken.kind === K.EqualsToken && isAssignmentPattern(node.left)) {
    buildValue(b, node.right);
    b.assignmentPattern(node.left);
    return;
  }
  // NOTE: iterate the left spine; `'a' + 'b' + …` in generated code can be thousands deep.
  const spine: ts.BinaryExpression[] = [node];
  let left = node.left;
  while (isPlainBinary(left)) {
    spine.push(left);
    left = left.left;
  }
  buildValue(b, left);
  for (let i = spine.length - 1; i >= 0; i--) buildValue(b, spine[i].right);
}

/** `a && b` / `a || b` as a value: the left operand short-circuits like a condition. */
function buildLogical(b: FlowBuilder, node: ts.BinaryExpression, kind: 'and' | 'or'): void {
  const d = b.decision(kind, node.left, node);
  const evaluateRight: number[] = [];
  const done: number[] = [];
  if (kind === 'and') b.condition(node.left, evaluateRight, done, d);
  else b.condition(node.left, done, evaluateRight, d);
  operandBranch(b, evaluateRight, node.right, done);
}

/** `a ?? b ?? c`: each `??` tests the value so far; left-deep chains are walked with a loop. */
function buildNullishChain(b: FlowBuilder, node: ts.BinaryExpression): void {
  const spine: ts.BinaryExpression[] = [node];
  let left = node.left;
  while (left.kind === K.BinaryExpression && (left as ts.BinaryExpression).operatorToken.kind === K.QuestionQuestionToken) {
    spine.push(left as ts.BinaryExpression);
    left = (left as ts.BinaryExpression).left;
  }
  buildValue(b, left);
  for (let i = spine.length - 1; i >= 0; i--) {
    const link = spine[i];
    const d = b.decision('nullish', link.left, link);
    const nullish: number[] = [];
    const present: number[] = [];
    b.decideNode(d, link.left, nullish, present);
    operandBranch(b, nullish, link.right, present);
  }
}

function buildLogicalAssignment(b: FlowBuilder, node: ts.BinaryExpression, kind: DecisionKind): void {
  buildValue(b, node.left);
  const d = b.decision(kind, node.left, node);
  const yes: number[] = [];
  const no: number[] = [];
  b.decideNode(d, node.left, yes, no);
  // `||=` assigns when the left operand is falsy; `&&=` when truthy; `??=` when nullish (true).
  if (kind === 'or-assign') operandBranch(b, no, node.right, yes);
  else operandBranch(b, yes, node.right, no);
}

function buildConditional(b: FlowBuilder, node: ts.ConditionalExpression): void {
  const d = b.decision('conditional', node.condition);
  const whenTrue: number[] = [];
  const whenFalse: number[] = [];
  b.condition(node.condition, whenTrue, whenFalse, d);
  b.w.merge(whenTrue);
  buildValue(b, node.whenTrue);
  b.w.emitNode(node.whenTrue);
  const afterTrue = b.w.take();
  operandBranch(b, whenFalse, node.whenFalse, afterTrue);
}

/** Control arrives on `enter`, evaluates `operand` in its own block, then joins `skipped`. */
function operandBranch(b: FlowBuilder, enter: number[], operand: ts.Node, skipped: number[]): void {
  b.w.merge(enter);
  buildValue(b, operand);
  b.w.emitNode(operand);
  b.w.merge(skipped);
}

type ChainLink = ts.PropertyAccessExpression | ts.ElementAccessExpression | ts.CallExpression | ts.NonNullExpression;

function isChainLink(node: ts.Node): node is ChainLink {
  const k = node.kind;
  return k === K.PropertyAccessExpression || k === K.ElementAccessExpression || k === K.CallExpression || k === K.NonNullExpression;
}

/**
 * A member/call chain, innermost object first. Each `?.` (with `optionalChaining`) is a decision
 * whose true edge (object nullish) jumps to the end of its optional chain, which ends at the first
 * link without the OptionalChain flag (parentheses end a chain too, as they end the spine).
 */
function buildAccessChain(b: FlowBuilder, node: ChainLink): void {
  const spine: ChainLink[] = [];
  let base: ts.Node = node;
  while (isChainLink(base)) {
    spine.push(base);
    base = base.expression;
  }
  buildValue(b, base);
  const counted = b.settings.optionalChaining;
  let shortCircuit: number[] | undefined;
  let chainTop: ts.Node = node;
  for (let i = spine.length - 1; i >= 0; i--) {
    const link = spine[i];
    const inChain = (link.flags & ts.NodeFlags.OptionalChain) !== 0;
    if (!inChain && shortCircuit) {
      endChain(b, chainTop, shortCircuit);
      shortCircuit = undefined;
    }
    if (counted && link.kind !== K.NonNullExpression && link.questionDotToken) {
      const d = b.decision('optional-chain', link.expression, link);
      shortCircuit ??= [];
      const present: number[] = [];
      b.decideNode(d, link.expression, shortCircuit, present);
      b.w.merge(present);
      chainTop = outermostChainLink(spine, i);
    }
    if (link.kind === K.ElementAccessExpression) buildValue(b, link.argumentExpression);
    else if (link.kind === K.CallExpression) for (const arg of link.arguments) buildValue(b, arg);
  }
  if (shortCircuit) endChain(b, chainTop, shortCircuit);
}

function outermostChainLink(spine: readonly ChainLink[], from: number): ChainLink {
  let top = from;
  while (top > 0 && (spine[top - 1].flags & ts.NodeFlags.OptionalChain) !== 0) top--;
  return spine[top];
}

/** The rest of the chain runs in its own block; then the short-circuit edges join. */
function endChain(b: FlowBuilder, chainTop: ts.Node, shortCircuit: number[]): void {
  b.w.emitNode(chainTop);
  b.w.merge(shortCircuit);
}
