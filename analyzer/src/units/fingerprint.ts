/**
 * Fingerprint of a unit
 * =====================
 * A hash of the unit's normalised body: the sequence of syntax kinds, with literal texts and
 * the names of things outside the unit kept, and every name the unit declares itself
 * (parameters, variables, functions, catch bindings) replaced by its order of first
 * declaration. Whitespace and comments never reach it. Two units with the same fingerprint
 * are the same code up to renaming of locals — used to follow a function that moved.
 * Nested units (callbacks, inner functions, class members) count as one opaque token each: they
 * have fingerprints of their own, and this keeps the work over a whole file linear.
 */
import { createHash } from 'node:crypto';
import { ts } from 'ts-morph';

/** 16 hex digits of SHA-256 over the normalised body; `isNestedUnit` marks the units inside it. */
export function fingerprint(node: ts.Node, isNestedUnit: (n: ts.Node) => boolean): string {
  const locals = declaredNames(node, isNestedUnit);
  const hash = createHash('sha256');
  const stack: ts.Node[] = [node];
  while (stack.length > 0) {
    const n = stack.pop()!;
    hash.update(String(n.kind));
    if (ts.isIdentifier(n) || ts.isPrivateIdentifier(n)) {
      const local = locals.get(n.text);
      hash.update(local !== undefined && !isPropertyName(n) ? `$${local}` : n.text);
    } else if (ts.isLiteralExpression(n) || ts.isTemplateLiteralToken(n)) {
      hash.update(n.text);
    } else if (ts.isBinaryExpression(n)) {
      hash.update(String(n.operatorToken.kind));
    } else if (ts.isPrefixUnaryExpression(n) || ts.isPostfixUnaryExpression(n)) {
      hash.update(String(n.operator));
    }
    hash.update(';');
    if (n !== node && isNestedUnit(n)) continue;
    const children: ts.Node[] = [];
    ts.forEachChild(n, (c) => {
      children.push(c);
    });
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]);
  }
  return hash.digest('hex').slice(0, 16);
}

function declaredNames(node: ts.Node, isNestedUnit: (n: ts.Node) => boolean): Map<string, number> {
  const names = new Map<string, number>();
  const add = (name: ts.Node | undefined) => {
    if (name && ts.isIdentifier(name) && !names.has(name.text)) names.set(name.text, names.size);
  };
  const stack: ts.Node[] = [node];
  while (stack.length > 0) {
    const n = stack.pop()!;
    if (ts.isParameter(n) || ts.isVariableDeclaration(n) || ts.isBindingElement(n) || ts.isFunctionDeclaration(n) || ts.isCatchClause(n)) {
      add(ts.isCatchClause(n) ? n.variableDeclaration?.name : n.name);
    }
    if (n !== node && isNestedUnit(n)) continue;
    const children: ts.Node[] = [];
    ts.forEachChild(n, (c) => {
      children.push(c);
    });
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]);
  }
  return names;
}

// `order.total` — `total` names a property, not a local, even if a local is also called `total`.
function isPropertyName(id: ts.Identifier | ts.PrivateIdentifier): boolean {
  const parent = id.parent;
  return !!parent && ((ts.isPropertyAccessExpression(parent) && parent.name === id) || (ts.isPropertyAssignment(parent) && parent.name === id));
}
