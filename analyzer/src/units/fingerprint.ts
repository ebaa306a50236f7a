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

/** 16 hex digits of SHA-1 over the normalised body; `isNestedUnit` marks the units inside it. */
export function fingerprint(node: ts.Node, isNestedUnit: (n: ts.Node) => boolean): string {
  // One walk: tokens go into `parts`; identifiers that might be locals are resolved once the
  // walk has seen every declaration (a local may be used before its declaration).
  const parts: string[] = [];
  const identifiers: number[] = [];
  const locals = new Map<string, number>();
  const stack: ts.Node[] = [node];
  while (stack.length > 0) {
    const n = stack.pop()!;
    const kind = n.kind;
    if (kind === ts.SyntaxKind.Identifier || kind === ts.SyntaxKind.PrivateIdentifier) {
      const text = (n as ts.Identifier).text;
      if (isDeclarationName(n)) {
        if (!locals.has(text)) locals.set(text, locals.size);
      }
      if (isPropertyName(n)) parts.push(text);
      else {
        identifiers.push(parts.length);
        parts.push(text);
      }
      continue;
    }
    if (kind >= ts.SyntaxKind.FirstLiteralToken && kind <= ts.SyntaxKind.LastTemplateToken) {
      parts.push(`${kind}:${(n as ts.LiteralLikeNode).text}`);
      continue;
    }
    if (kind === ts.SyntaxKind.BinaryExpression) parts.push(`${kind}:${(n as ts.BinaryExpression).operatorToken.kind}`);
    else if (kind === ts.SyntaxKind.PrefixUnaryExpression || kind === ts.SyntaxKind.PostfixUnaryExpression) {
      parts.push(`${kind}:${(n as ts.PrefixUnaryExpression).operator}`);
    } else parts.push(String(kind));
    if (n !== node && isNestedUnit(n)) continue;
    const start = stack.length;
    ts.forEachChild(n, (c) => {
      stack.push(c);
    });
    reverse(stack, start);
  }
  for (const i of identifiers) {
    const local = locals.get(parts[i]);
    if (local !== undefined) parts[i] = `$${local}`;
  }
  return createHash('sha1').update(parts.join('\u0001')).digest('hex').slice(0, 16);
}

function reverse(stack: ts.Node[], from: number): void {
  for (let i = from, j = stack.length - 1; i < j; i++, j--) [stack[i], stack[j]] = [stack[j], stack[i]];
}

// The name a parameter, variable, binding element, function or catch clause declares.
function isDeclarationName(id: ts.Node): boolean {
  const parent = id.parent;
  if (!parent) return false;
  switch (parent.kind) {
    case ts.SyntaxKind.Parameter:
    case ts.SyntaxKind.VariableDeclaration:
    case ts.SyntaxKind.BindingElement:
    case ts.SyntaxKind.FunctionDeclaration:
      return (parent as ts.NamedDeclaration).name === id;
    default:
      return false;
  }
}

// `order.total` — `total` names a property, not a local, even if a local is also called `total`.
function isPropertyName(id: ts.Node): boolean {
  const parent = id.parent;
  return !!parent && ((ts.isPropertyAccessExpression(parent) && parent.name === id) || (ts.isPropertyAssignment(parent) && parent.name === id));
}
