import { ts } from '../compiler';

/** Name given to a unit that has none of its own (display form adds `@line`). */
export const ANONYMOUS = '<anonymous>';

/**
 * The readable name of a function-like node, taken from the node itself or from where it
 * stands: `const f = () => …` → `f`, `{ f: function () {} }` → `f`, `a.b = () => …` → `a.b`,
 * `export default function () {}` → `default`. Returns undefined for a truly anonymous unit.
 */
export function unitName(node: ts.Node, sourceFile: ts.SourceFile): string | undefined {
  if (ts.isConstructorDeclaration(node)) return 'constructor';
  if (ts.isClassStaticBlockDeclaration(node)) return '<static>';
  const own = (node as { name?: ts.Node }).name;
  if (own) return propertyNameText(own, sourceFile);
  if (ts.isFunctionDeclaration(node) || ts.isClassDeclaration(node)) {
    return hasDefaultModifier(node) ? 'default' : undefined;
  }
  return nameFromContext(node, sourceFile);
}

/** Text of a declaration name; computed names keep their source text in brackets. */
export function propertyNameText(name: ts.Node, sourceFile: ts.SourceFile): string {
  if (ts.isIdentifier(name) || ts.isPrivateIdentifier(name)) return name.text;
  if (ts.isStringLiteral(name) || ts.isNumericLiteral(name) || ts.isNoSubstitutionTemplateLiteral(name)) return name.text;
  return `[${collapse(name.getText(sourceFile))}]`;
}

function nameFromContext(node: ts.Node, sourceFile: ts.SourceFile): string | undefined {
  let parent = node.parent;
  // `(() => …)`, `x as Handler`, `fn!` and `satisfies` do not change what the function is called.
  while (parent && (ts.isParenthesizedExpression(parent) || ts.isAsExpression(parent) || ts.isSatisfiesExpression(parent) || ts.isNonNullExpression(parent) || ts.isTypeAssertionExpression(parent))) {
    parent = parent.parent;
  }
  if (!parent) return undefined;
  if ((ts.isVariableDeclaration(parent) || ts.isPropertyAssignment(parent) || ts.isPropertyDeclaration(parent)) && parent.name && !ts.isObjectBindingPattern(parent.name) && !ts.isArrayBindingPattern(parent.name)) {
    return propertyNameText(parent.name, sourceFile);
  }
  if (ts.isBinaryExpression(parent) && parent.operatorToken.kind === ts.SyntaxKind.EqualsToken && (ts.isIdentifier(parent.left) || ts.isPropertyAccessExpression(parent.left))) {
    return collapse(parent.left.getText(sourceFile));
  }
  if (ts.isExportAssignment(parent)) return 'default';
  return undefined;
}

function hasDefaultModifier(node: ts.Node): boolean {
  return !!ts.canHaveModifiers(node) && !!ts.getModifiers(node)?.some((m) => m.kind === ts.SyntaxKind.DefaultKeyword);
}

function collapse(text: string): string {
  const oneLine = text.replace(/\s+/g, ' ');
  return oneLine.length > 60 ? `${oneLine.slice(0, 57)}...` : oneLine;
}
