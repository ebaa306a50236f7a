/**
 * Finding function units
 * ======================
 * Walks a source file once (explicit stack, raw compiler nodes) and lists every unit Seamline
 * measures: function declarations and expressions, arrow functions, methods, constructors,
 * get/set accessors, class static blocks, class field initialisers (only those whose
 * expression holds a decision; `hasDecision` decides), and the file's top-level code.
 * Bodiless declarations (overloads, abstract and ambient members) are not units. Each unit
 * gets a qualified name built from the classes, namespaces, named object literals and
 * functions around it, e.g. `OrderService.assignCourier` or `routes.<anonymous>@42`.
 */
import { ts } from '../compiler';
import type { FunctionKind } from '../model';
import { ANONYMOUS, propertyNameText, unitName } from './unitName';

export interface FoundUnit {
  node: ts.Node;
  kind: FunctionKind;
  name: string;
  /** For display: anonymous parts carry `@line`. */
  qualifiedName: string;
  /** For ids: anonymous parts without line numbers, so moving code does not rename them. */
  stableName: string;
}

interface Frame {
  node: ts.Node;
  display: string[];
  stable: string[];
}

/** Every unit of the file, top-level code first, then in source order. */
export function findUnits(sourceFile: ts.SourceFile, hasDecision: (field: ts.PropertyDeclaration) => boolean): FoundUnit[] {
  const units: FoundUnit[] = [{ node: sourceFile, kind: 'top-level', name: '<top-level>', qualifiedName: '<top-level>', stableName: '<top-level>' }];
  const stack: Frame[] = [];
  pushChildren(stack, sourceFile, [], []);
  while (stack.length > 0) {
    const { node, display, stable } = stack.pop()!;
    // Types hold no code to run, so no units; skipping them spares much of a typed file.
    if (ts.isTypeNode(node) && !ts.isExpressionWithTypeArguments(node)) continue;
    const kind = unitKind(node, hasDecision);
    if (kind) {
      const own = unitName(node, sourceFile);
      const line = sourceFile.getLineAndCharacterOfPosition(node.getStart(sourceFile)).line + 1;
      const name = own ?? `${ANONYMOUS}@${line}`;
      const qualifiedName = [...display, name].join('.');
      const stableName = [...stable, own ?? ANONYMOUS].join('.');
      units.push({ node, kind, name, qualifiedName, stableName });
      pushChildren(stack, node, [...display, name], [...stable, own ?? ANONYMOUS]);
    } else {
      const scope = scopeName(node, sourceFile);
      if (scope) pushChildren(stack, node, [...display, scope], [...stable, scope]);
      else pushChildren(stack, node, display, stable);
    }
  }
  return units;
}

function pushChildren(stack: Frame[], node: ts.Node, display: string[], stable: string[]): void {
  const children: ts.Node[] = [];
  ts.forEachChild(node, (child) => {
    children.push(child);
  });
  for (let i = children.length - 1; i >= 0; i--) stack.push({ node: children[i], display, stable });
}

function unitKind(node: ts.Node, hasDecision: (field: ts.PropertyDeclaration) => boolean): FunctionKind | undefined {
  switch (node.kind) {
    case ts.SyntaxKind.FunctionDeclaration:
    case ts.SyntaxKind.FunctionExpression:
      return (node as ts.FunctionLikeDeclaration).body ? 'function' : undefined;
    case ts.SyntaxKind.ArrowFunction:
      return 'arrow';
    case ts.SyntaxKind.MethodDeclaration:
      return (node as ts.MethodDeclaration).body ? 'method' : undefined;
    case ts.SyntaxKind.Constructor:
      return (node as ts.ConstructorDeclaration).body ? 'constructor' : undefined;
    case ts.SyntaxKind.GetAccessor:
      return (node as ts.GetAccessorDeclaration).body ? 'getter' : undefined;
    case ts.SyntaxKind.SetAccessor:
      return (node as ts.SetAccessorDeclaration).body ? 'setter' : undefined;
    case ts.SyntaxKind.ClassStaticBlockDeclaration:
      return 'static-block';
    case ts.SyntaxKind.PropertyDeclaration: {
      const field = node as ts.PropertyDeclaration;
      return field.initializer && hasDecision(field) ? 'field-initializer' : undefined;
    }
    default:
      return undefined;
  }
}

/** Names that qualify the units inside them without being units themselves. */
function scopeName(node: ts.Node, sourceFile: ts.SourceFile): string | undefined {
  if (ts.isClassDeclaration(node) || ts.isClassExpression(node)) {
    return node.name?.text ?? unitName(node, sourceFile) ?? '<class>';
  }
  if (ts.isModuleDeclaration(node)) return propertyNameText(node.name, sourceFile);
  if (ts.isObjectLiteralExpression(node)) return unitName(node, sourceFile);
  return undefined;
}
