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
 *
 * The hash is two independent 32-bit FNV-1a lanes (64 bits), fed token by token without
 * building strings — a fingerprint identifies code, it does not protect anything.
 * [Reference]: Fowler, Noll, Vo, "FNV hash" (common practice for fast non-cryptographic hashing).
 */
import { ts } from '../compiler';

// Read once: each `ts.` member is a getter on the compiler's module object, and these are read per node.
const { Identifier, PrivateIdentifier, FirstLiteralToken, LastTemplateToken, BinaryExpression, PrefixUnaryExpression, PostfixUnaryExpression, Parameter,
  VariableDeclaration, BindingElement, FunctionDeclaration, PropertyAccessExpression, PropertyAssignment } = ts.SyntaxKind;

const PRIME = 16777619;

class Fnv64 {
  private a = 2166136261;
  private b = 84696351;

  /** Adds one number (a syntax kind, an operator, a local's index). */
  int(value: number): void {
    this.a = Math.imul(this.a ^ (value & 0xffff), PRIME);
    this.a = Math.imul(this.a ^ (value >>> 16), PRIME);
    this.b = Math.imul(this.b ^ ((value * 31 + 7) & 0xffff), PRIME);
    this.b = Math.imul(this.b ^ (value >>> 16), PRIME);
  }

  /** Adds a text, with its length so that adjacent texts cannot run together. */
  text(value: string): void {
    this.int(value.length);
    for (let i = 0; i < value.length; i++) {
      const c = value.charCodeAt(i);
      this.a = Math.imul(this.a ^ c, PRIME);
      this.b = Math.imul(this.b ^ (c + 0x9e37), PRIME);
    }
  }

  hex(): string {
    return (this.a >>> 0).toString(16).padStart(8, '0') + (this.b >>> 0).toString(16).padStart(8, '0');
  }
}

// Marks in the stream, so that a local's index cannot be mistaken for a syntax kind or a name.
const LOCAL = -1;
const NAME = -2;
const LITERAL = -3;

/** 16 hex digits identifying the normalised body; `isNestedUnit` marks the units inside it. */
export function fingerprint(node: ts.Node, isNestedUnit: (n: ts.Node) => boolean): string {
  return fingerprintOf(unitNodes(node, isNestedUnit));
}

/**
 * The unit's own nodes in pre-order (source order), the unit first: a nested unit is listed,
 * its insides are not. findUnits gathers the same lists on its walk of the file.
 */
export function unitNodes(node: ts.Node, isNestedUnit: (n: ts.Node) => boolean): ts.Node[] {
  const listed: ts.Node[] = [];
  const stack: ts.Node[] = [node];
  while (stack.length > 0) {
    const n = stack.pop()!;
    listed.push(n);
    if (n !== node && isNestedUnit(n)) continue;
    const start = stack.length;
    ts.forEachChild(n, (c) => {
      stack.push(c);
    });
    for (let i = start, j = stack.length - 1; i < j; i++, j--) [stack[i], stack[j]] = [stack[j], stack[i]];
  }
  return listed;
}

/** The fingerprint of a unit from its own nodes, as `unitNodes` lists them. */
export function fingerprintOf(nodes: readonly ts.Node[]): string {
  // Locals are numbered in a first pass, because one may be used before its declaration (a
  // hoisted function, a closure); the second pass hashes the token stream.
  const locals = new Map<string, number>();
  for (let i = 0; i < nodes.length; i++) {
    const n = nodes[i];
    if ((n.kind === Identifier || n.kind === PrivateIdentifier) && isDeclarationName(n)) {
      const text = (n as ts.Identifier).text;
      if (!locals.has(text)) locals.set(text, locals.size);
    }
  }
  const hash = new Fnv64();
  for (let i = 0; i < nodes.length; i++) {
    const n = nodes[i];
    const kind = n.kind;
    if (kind === Identifier || kind === PrivateIdentifier) {
      const text = (n as ts.Identifier).text;
      const property = isPropertyName(n);
      hash.int(property ? NAME : LOCAL);
      const local = property ? undefined : locals.get(text);
      if (local !== undefined) hash.int(local);
      else hash.text(text);
    } else if (kind >= FirstLiteralToken && kind <= LastTemplateToken) {
      hash.int(LITERAL);
      hash.int(kind);
      hash.text((n as ts.LiteralLikeNode).text);
    } else {
      hash.int(kind);
      if (kind === BinaryExpression) hash.int((n as ts.BinaryExpression).operatorToken.kind);
      else if (kind === PrefixUnaryExpression || kind === PostfixUnaryExpression) hash.int((n as ts.PrefixUnaryExpression).operator);
    }
  }
  return hash.hex();
}

// The name a parameter, variable, binding element or function declares (catch bindings are variables).
function isDeclarationName(id: ts.Node): boolean {
  const parent = id.parent;
  if (!parent) return false;
  switch (parent.kind) {
    case Parameter:
    case VariableDeclaration:
    case BindingElement:
    case FunctionDeclaration:
      return (parent as ts.NamedDeclaration).name === id;
    default:
      return false;
  }
}

// `order.total` — `total` names a property, not a local, even if a local is also called `total`.
function isPropertyName(id: ts.Node): boolean {
  const parent = id.parent;
  return !!parent && ((parent.kind === PropertyAccessExpression || parent.kind === PropertyAssignment) && (parent as ts.PropertyAccessExpression | ts.PropertyAssignment).name === id);
}
