/**
 * Default values and destructuring
 * ================================
 * Parameter defaults, destructuring defaults in declarations (`const {a = 1} = o`), in
 * assignments (`({a = 1} = o)`, `[a = 1] = arr`) and in for-in/of heads. With `defaultValues`
 * each default is a decision: true = the value is `undefined`, so the default expression runs in
 * its own block; false = it is skipped. Without the setting the default expression is built
 * inline (its own `&&`, `?:`… still count). Computed keys and assignment targets are built as
 * values. Patterns nest no deeper than the parser nested them.
 */
import { ts } from '../compiler';
import type { FlowBuilder } from './FlowBuilder';
import { isAssignmentPattern } from './unitBoundaries';

const K = ts.SyntaxKind;

/** A default value `element` (parameter, binding element, `x = 1` target, shorthand `{x = 1}`) with its expression. */
export function buildDefaultValue(b: FlowBuilder, element: ts.Node, initializer: ts.Expression): void {
  if (!b.settings.defaultValues) {
    b.value(initializer);
    return;
  }
  const d = b.decision('default-value', element);
  const missing: number[] = [];
  const present: number[] = [];
  b.decideNode(d, element, missing, present);
  b.w.merge(missing);
  b.value(initializer);
  b.w.emitNode(initializer);
  b.w.merge(present);
}

/** A function's parameters: defaults first, then the parameter's own destructuring. */
export function buildParameters(b: FlowBuilder, parameters: readonly ts.ParameterDeclaration[]): void {
  for (const parameter of parameters) {
    if (parameter.initializer) buildDefaultValue(b, parameter, parameter.initializer);
    if (parameter.name.kind !== K.Identifier) buildBindingPattern(b, parameter.name);
  }
}

/** `const { [k]: a = 1, b: [c = 2] } = …` and the same in parameters, catch clauses and loop heads. */
export function buildBindingPattern(b: FlowBuilder, pattern: ts.BindingPattern): void {
  for (const element of pattern.elements) {
    if (element.kind === K.OmittedExpression) continue;
    if (element.propertyName?.kind === K.ComputedPropertyName) b.value(element.propertyName.expression);
    if (element.initializer) buildDefaultValue(b, element, element.initializer);
    if (element.name.kind !== K.Identifier) buildBindingPattern(b, element.name);
  }
}

/** `({ a = 1, b: [c = 2], ...rest } = o)` / `[x = 1, ...ys] = arr`, after the right-hand side. */
export function buildAssignmentPattern(b: FlowBuilder, pattern: ts.ObjectLiteralExpression | ts.ArrayLiteralExpression): void {
  if (pattern.kind === K.ArrayLiteralExpression) {
    for (const element of pattern.elements) {
      if (element.kind === K.OmittedExpression) continue;
      buildTarget(b, element.kind === K.SpreadElement ? (element as ts.SpreadElement).expression : element);
    }
    return;
  }
  for (const property of pattern.properties) {
    switch (property.kind) {
      case K.PropertyAssignment:
        if (property.name.kind === K.ComputedPropertyName) b.value(property.name.expression);
        buildTarget(b, property.initializer);
        break;
      case K.ShorthandPropertyAssignment:
        if (property.objectAssignmentInitializer) buildDefaultValue(b, property, property.objectAssignmentInitializer);
        break;
      case K.SpreadAssignment:
        buildTarget(b, property.expression);
        break;
      default:
        // Methods and accessors cannot appear in a pattern (the parser already reported it).
        break;
    }
  }
}

/** One destructuring target: `t = default`, a nested pattern, or a reference such as `o[k]`. */
function buildTarget(b: FlowBuilder, target: ts.Expression): void {
  if (target.kind === K.BinaryExpression && (target as ts.BinaryExpression).operatorToken.kind === K.EqualsToken) {
    const { left, right } = target as ts.BinaryExpression;
    if (!isAssignmentPattern(left)) b.value(left);
    buildDefaultValue(b, target, right);
    if (isAssignmentPattern(left)) buildAssignmentPattern(b, left);
    return;
  }
  if (isAssignmentPattern(target)) buildAssignmentPattern(b, target);
  else b.value(target);
}

/** `let a = …, { b = 1 } = …`: each initializer, then its destructuring. */
export function buildDeclarations(b: FlowBuilder, list: ts.VariableDeclarationList): void {
  for (const declaration of list.declarations) {
    if (declaration.initializer) b.value(declaration.initializer);
    if (declaration.name.kind !== K.Identifier) buildBindingPattern(b, declaration.name);
  }
}
