/**
 * Unit boundaries
 * ===============
 * Which syntax belongs to which function unit. Both the flow-graph builder and the syntax-tree
 * decision count use these helpers, so the cross-check V(G) = decisions + 1 compares two
 * independent counts over the same code.
 *
 * Units: function-likes (declarations, expressions, arrows, methods, constructors, accessors),
 * class static blocks, class field initialisers, and a file's top-level code.
 * - A nested unit is never entered from its parent. Its parameter defaults belong to it.
 * - What runs when a class or object literal is *defined* belongs to the unit that defines it:
 *   decorators (class, member and parameter decorators), the `extends` expression and computed
 *   member names. Member bodies, field initialisers and static blocks are their own units.
 * - Type-only syntax (type annotations, interfaces, type aliases) and ambient code (`declare`,
 *   everything inside `declare namespace`) hold no runtime code and are skipped.
 * - A namespace body runs as part of the code around it (the file's top-level code).
 */
import { ts } from '../compiler';
import { FlowGraphError } from './FlowGraphError';

const K = ts.SyntaxKind;
// NodeFlags.Ambient is set by the parser on `declare` code and everything inside it; the public typings hide it.
const AMBIENT = (ts.NodeFlags as unknown as { Ambient?: number }).Ambient ?? 1 << 25;

/** The code of one unit: its parameters, then either statements or one expression. */
export interface UnitParts {
  parameters: readonly ts.ParameterDeclaration[];
  statements?: readonly ts.Statement[];
  expression?: ts.Expression;
}

/** Whether the node is a unit of its own (never entered from an enclosing unit). */
export function isUnitBoundary(node: ts.Node): boolean {
  switch (node.kind) {
    case K.FunctionDeclaration:
    case K.FunctionExpression:
    case K.ArrowFunction:
    case K.MethodDeclaration:
    case K.Constructor:
    case K.GetAccessor:
    case K.SetAccessor:
    case K.ClassStaticBlockDeclaration:
    case K.PropertyDeclaration:
      return true;
    default:
      return false;
  }
}

/** Whether the node holds no runtime code: type syntax, interfaces, type aliases, ambient declarations. */
export function isTypeOrAmbient(node: ts.Node): boolean {
  const kind = node.kind;
  if (kind >= K.FirstTypeNode && kind <= K.LastTypeNode) return true;
  if (kind === K.TypeParameter || kind === K.InterfaceDeclaration || kind === K.TypeAliasDeclaration) return true;
  return (node.flags & AMBIENT) !== 0;
}

/** Whether an expression on the left of `=` (or in a for-in/of head) is a destructuring pattern. */
export function isAssignmentPattern(node: ts.Node): node is ts.ObjectLiteralExpression | ts.ArrayLiteralExpression {
  return node.kind === K.ObjectLiteralExpression || node.kind === K.ArrayLiteralExpression;
}

function forEachDecorator(node: ts.HasModifiers, visit: (expression: ts.Expression) => void): void {
  const modifiers = node.modifiers;
  if (!modifiers) return;
  for (const modifier of modifiers) {
    if (modifier.kind === K.Decorator) visit((modifier as ts.Decorator).expression);
  }
}

/**
 * Calls `visit` for each expression evaluated when the class is defined, in source order:
 * class decorators, the `extends` expression, then per member its decorators, computed name
 * and parameter decorators.
 */
export function forEachClassPart(node: ts.ClassLikeDeclaration, visit: (expression: ts.Expression) => void): void {
  forEachDecorator(node, visit);
  for (const clause of node.heritageClauses ?? []) {
    if (clause.token === K.ExtendsKeyword) for (const type of clause.types) visit(type.expression);
  }
  for (const member of node.members) {
    if (ts.canHaveModifiers(member)) forEachDecorator(member, visit);
    if (member.name && member.name.kind === K.ComputedPropertyName) visit(member.name.expression);
    if (ts.isFunctionLike(member)) {
      for (const parameter of member.parameters) forEachDecorator(parameter, visit);
    }
  }
}

/** Calls `visit` for what a nested unit leaves to its parent: an object-literal method's computed name. */
export function forEachParentPart(node: ts.Node, visit: (expression: ts.Expression) => void): void {
  if (node.kind !== K.MethodDeclaration && node.kind !== K.GetAccessor && node.kind !== K.SetAccessor) return;
  if (node.parent?.kind !== K.ObjectLiteralExpression) return;
  const name = (node as ts.MethodDeclaration).name;
  if (name.kind === K.ComputedPropertyName) visit(name.expression);
}

/** The parts of a unit node: parameters, and its statements or expression body. */
export function unitParts(unit: ts.Node): UnitParts {
  switch (unit.kind) {
    case K.SourceFile:
      return { parameters: [], statements: (unit as ts.SourceFile).statements };
    case K.ClassStaticBlockDeclaration:
      return { parameters: [], statements: (unit as ts.ClassStaticBlockDeclaration).body.statements };
    case K.PropertyDeclaration: {
      const initializer = (unit as ts.PropertyDeclaration).initializer;
      return initializer ? { parameters: [], expression: initializer } : { parameters: [], statements: [] };
    }
    case K.FunctionDeclaration:
    case K.FunctionExpression:
    case K.ArrowFunction:
    case K.MethodDeclaration:
    case K.Constructor:
    case K.GetAccessor:
    case K.SetAccessor: {
      const fn = unit as ts.FunctionLikeDeclaration;
      const body = fn.body;
      if (!body) return { parameters: fn.parameters, statements: [] };
      if (body.kind === K.Block) return { parameters: fn.parameters, statements: (body as ts.Block).statements };
      return { parameters: fn.parameters, expression: body as ts.Expression };
    }
    default:
      throw new FlowGraphError(`a ${K[unit.kind]} is not a function unit`);
  }
}
