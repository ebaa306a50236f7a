/**
 * Decision count on the syntax tree
 * =================================
 * Counts a unit's decisions (π) by a plain walk over its syntax, independently of the flow
 * graph, so that V(G) = E − N + 2P = π + 1 is a cross-check that can fail. Unit boundaries are
 * the builder's (unitBoundaries.ts); everything else is counted here from node kinds alone.
 *
 * +1 each: `if`, `?:`, each non-default `case`, `for` (also `for (;;)`), `for-in`, `for-of`,
 * `while`, `do-while`, `catch`, each `&&` / `||` / `??` (anywhere, not only in conditions), each
 * `&&=` / `||=` / `??=`; each `?.` only with `optionalChaining`; each default value (parameter,
 * binding element, `{a = 1}` and `[a = 1]` in destructuring assignments) only with
 * `defaultValues`. Nothing for `else`, `try`, `finally`, `break`, `continue`, `return`, `throw`,
 * `default:`.
 *
 * Edge cases: an explicit stack, no recursion (left-deep chains of thousands of terms are fine);
 * `casesPerSwitch` lists every switch in source order, including those with no case.
 *
 * [Reference]: Watson & McCabe, NIST SP 500-235 §4.1 (v = π + 1 for binary decisions, source-level
 * counting); ESLint 9 `complexity` rule for the optional constructs (reference-checks §8).
 */
import { ts } from '../compiler';
import {
  forEachClassPart,
  forEachParentPart,
  isAssignmentPattern,
  isTypeOrAmbient,
  isUnitBoundary,
  unitParts,
} from '../cfg/unitBoundaries';
import type { CountingSettings } from '../model/CountingSettings';
import type { DecisionKind } from '../model/FlowGraph';

const K = ts.SyntaxKind;
// Read once: each `ts.` member is a getter on the compiler's module object, and this runs per node.
const forEachChild = ts.forEachChild;

/** A unit's decisions counted on the syntax tree. */
export interface DecisionCount {
  total: number;
  byKind: Partial<Record<DecisionKind, number>>;
  /** Non-default cases of each switch statement, in source order. */
  casesPerSwitch: number[];
}

const OPERATOR_KINDS: Partial<Record<ts.SyntaxKind, DecisionKind>> = {
  [K.AmpersandAmpersandToken]: 'and',
  [K.BarBarToken]: 'or',
  [K.QuestionQuestionToken]: 'nullish',
  [K.AmpersandAmpersandEqualsToken]: 'and-assign',
  [K.BarBarEqualsToken]: 'or-assign',
  [K.QuestionQuestionEqualsToken]: 'nullish-assign',
};

const STATEMENT_KINDS: Partial<Record<ts.SyntaxKind, DecisionKind>> = {
  [K.IfStatement]: 'if',
  [K.ConditionalExpression]: 'conditional',
  [K.ForStatement]: 'for',
  [K.ForInStatement]: 'for-in',
  [K.ForOfStatement]: 'for-of',
  [K.WhileStatement]: 'while',
  [K.DoStatement]: 'do-while',
  [K.CatchClause]: 'catch',
};

/** Counts the decisions of one unit (same unit kinds as `buildFlowGraph`). */
export function countDecisions(unit: ts.Node, _sourceFile: ts.SourceFile, settings: CountingSettings): DecisionCount {
  const byKind: Partial<Record<DecisionKind, number>> = {};
  const switches: { pos: number; cases: number }[] = [];
  let total = 0;
  const add = (kind: DecisionKind, n = 1): void => {
    byKind[kind] = (byKind[kind] ?? 0) + n;
    total += n;
  };
  // Two parallel stacks: the node and whether it is a destructuring-assignment pattern/target.
  const nodes: ts.Node[] = [];
  const inPattern: boolean[] = [];
  const push = (node: ts.Node): undefined => {
    nodes.push(node);
    inPattern.push(false);
    return undefined;
  };
  const pushTarget = (target: ts.Node): void => {
    if (target.kind === K.BinaryExpression && (target as ts.BinaryExpression).operatorToken.kind === K.EqualsToken) {
      if (settings.defaultValues) add('default-value');
      push((target as ts.BinaryExpression).right);
      pushTarget((target as ts.BinaryExpression).left);
    } else if (isAssignmentPattern(target)) {
      nodes.push(target);
      inPattern.push(true);
    } else {
      push(target);
    }
  };

  const parts = unitParts(unit);
  for (const parameter of parts.parameters) {
    if (parameter.initializer) {
      if (settings.defaultValues) add('default-value');
      push(parameter.initializer);
    }
    push(parameter.name);
  }
  for (const statement of parts.statements ?? []) push(statement);
  if (parts.expression) push(parts.expression);

  while (nodes.length > 0) {
    const node = nodes.pop()!;
    if (inPattern.pop()) {
      visitPattern(node as ts.ObjectLiteralExpression | ts.ArrayLiteralExpression, push, pushTarget, settings, add);
      continue;
    }
    if (isTypeOrAmbient(node)) continue;
    if (isUnitBoundary(node)) {
      forEachParentPart(node, push);
      continue;
    }
    const kind = node.kind;
    if (kind === K.ClassDeclaration || kind === K.ClassExpression) {
      forEachClassPart(node as ts.ClassLikeDeclaration, push);
      continue;
    }
    const statementKind = STATEMENT_KINDS[kind];
    if (statementKind) add(statementKind);
    switch (kind) {
      case K.BinaryExpression: {
        const binary = node as ts.BinaryExpression;
        const operator = OPERATOR_KINDS[binary.operatorToken.kind];
        if (operator) add(operator);
        else if (binary.operatorToken.kind === K.EqualsToken && isAssignmentPattern(binary.left)) {
          push(binary.right);
          pushTarget(binary.left);
          continue;
        }
        break;
      }
      case K.SwitchStatement: {
        let cases = 0;
        for (const clause of (node as ts.SwitchStatement).caseBlock.clauses) if (clause.kind === K.CaseClause) cases++;
        switches.push({ pos: node.pos, cases });
        add('case', cases);
        break;
      }
      case K.PropertyAccessExpression:
      case K.ElementAccessExpression:
      case K.CallExpression:
        if (settings.optionalChaining && (node as ts.PropertyAccessExpression).questionDotToken) add('optional-chain');
        break;
      case K.BindingElement:
        if (settings.defaultValues && (node as ts.BindingElement).initializer) add('default-value');
        break;
      case K.ForInStatement:
      case K.ForOfStatement: {
        const loop = node as ts.ForInStatement | ts.ForOfStatement;
        if (isAssignmentPattern(loop.initializer)) {
          pushTarget(loop.initializer);
          push(loop.expression);
          push(loop.statement);
          continue;
        }
        break;
      }
      default:
        break;
    }
    forEachChild(node, push);
  }
  switches.sort((a, b) => a.pos - b.pos);
  return { total, byKind, casesPerSwitch: switches.map((s) => s.cases) };
}

function visitPattern(
  pattern: ts.ObjectLiteralExpression | ts.ArrayLiteralExpression,
  push: (node: ts.Node) => void,
  pushTarget: (node: ts.Node) => void,
  settings: CountingSettings,
  add: (kind: DecisionKind) => void,
): void {
  if (pattern.kind === K.ArrayLiteralExpression) {
    for (const element of pattern.elements) {
      if (element.kind === K.OmittedExpression) continue;
      pushTarget(element.kind === K.SpreadElement ? (element as ts.SpreadElement).expression : element);
    }
    return;
  }
  for (const property of pattern.properties) {
    if (property.kind === K.PropertyAssignment) {
      if (property.name.kind === K.ComputedPropertyName) push(property.name.expression);
      pushTarget(property.initializer);
    } else if (property.kind === K.ShorthandPropertyAssignment) {
      if (property.objectAssignmentInitializer) {
        if (settings.defaultValues) add('default-value');
        push(property.objectAssignmentInitializer);
      }
    } else if (property.kind === K.SpreadAssignment) {
      pushTarget(property.expression);
    }
  }
}
