/**
 * Conditions
 * ==========
 * Builds an expression whose truth picks a branch (`if`, loops, `?:`, the left operand of `&&` /
 * `||`) as short-circuit structure: `a && b` sends a falsy `a` straight to the false target and
 * tests `b` only when `a` is truthy; `a || b` the other way round; `!` swaps the targets of a
 * compound operand; parentheses are transparent. Each operator's decision is the block testing
 * the last operand of its left side; the caller's decision (`owner`) is the block testing the
 * last operand of the whole condition. Anything else (`??`, `?:`, calls…) is built as a value and
 * then tested once by the owner's block.
 *
 *   if (a && b || c) T(); else F();
 *
 *   [a]──t──▶[b]──t─────▶[T]     [a] decision of `&&` (tests its left operand a)
 *    │f       │f          ▲      [b] decision of `||` (tests the last operand of a && b)
 *    └───────▶[c]──t──────┘      [c] decision of `if` (tests the last operand of the condition)
 *              └──f──▶[F]
 *
 * Edge cases: a left-deep chain `a && b && … ` is walked along its left spine with a loop (a
 * 5,000-term chain does not overflow); labels under `!` stay relative to the owner's own meaning
 * (the `if` decision's true edge always leads to the then-branch).
 *
 * [Reference]: McCabe 1976, IEEE TSE SE-2(4): `IF C1 AND C2` is two predicates.
 */
import { ts } from '../compiler';
import type { FlowBuilder } from './FlowBuilder';

const K = ts.SyntaxKind;

function isAndOr(node: ts.Node): node is ts.BinaryExpression {
  if (node.kind !== K.BinaryExpression) return false;
  const op = (node as ts.BinaryExpression).operatorToken.kind;
  return op === K.AmpersandAmpersandToken || op === K.BarBarToken;
}

/** Whether `node`, under parentheses and `!`, is an `&&` / `||` expression. */
function isCompound(node: ts.Node): boolean {
  for (;;) {
    if (node.kind === K.ParenthesizedExpression) node = (node as ts.ParenthesizedExpression).expression;
    else if (isNot(node)) node = node.operand;
    else return isAndOr(node);
  }
}

function isNot(node: ts.Node): node is ts.PrefixUnaryExpression {
  return node.kind === K.PrefixUnaryExpression && (node as ts.PrefixUnaryExpression).operator === K.ExclamationToken;
}

/** Builds `expr` as a condition going to `onTrue` / `onFalse`; its last test is `owner`'s block. */
export function buildCondition(
  b: FlowBuilder,
  expr: ts.Expression,
  onTrue: number[],
  onFalse: number[],
  owner: number,
  negated: boolean,
): void {
  for (;;) {
    if (expr.kind === K.ParenthesizedExpression) {
      expr = (expr as ts.ParenthesizedExpression).expression;
    } else if (isNot(expr) && isCompound(expr.operand)) {
      const swap = onTrue;
      onTrue = onFalse;
      onFalse = swap;
      negated = !negated;
      expr = expr.operand;
    } else {
      break;
    }
  }
  if (!isAndOr(expr)) {
    b.value(expr);
    b.decideNode(owner, expr, onTrue, onFalse, negated);
    return;
  }
  // Top-down: the targets of each level's left operand; bottom-up: build the operands in order.
  const levels: ts.BinaryExpression[] = [];
  const rightTrue: number[][] = [];
  const rightFalse: number[][] = [];
  const rightOwner: number[] = [];
  const rightNegated: boolean[] = [];
  const middles: number[][] = [];
  let node: ts.Expression = expr;
  while (isAndOr(node)) {
    const level = node;
    levels.push(level);
    rightTrue.push(onTrue);
    rightFalse.push(onFalse);
    rightOwner.push(owner);
    rightNegated.push(negated);
    const middle: number[] = [];
    middles.push(middle);
    const isAnd = level.operatorToken.kind === K.AmpersandAmpersandToken;
    owner = b.decision(isAnd ? 'and' : 'or', level.left, level);
    negated = false;
    if (isAnd) onTrue = middle;
    else onFalse = middle;
    node = level.left;
  }
  buildCondition(b, node, onTrue, onFalse, owner, negated);
  for (let i = levels.length - 1; i >= 0; i--) {
    b.w.merge(middles[i]);
    buildCondition(b, levels[i].right, rightTrue[i], rightFalse[i], rightOwner[i], rightNegated[i]);
  }
}
