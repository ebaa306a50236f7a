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
  /**
   * The unit's own nodes in source order (pre-order), the unit itself first; a nested unit is
   * listed but not its insides. What `unitNodes` gives, gathered on this walk (fingerprints use it).
   */
  nodes: ts.Node[];
}

const K = ts.SyntaxKind;
// Read once: each `ts.` member is a getter on the compiler's module object.
const forEachChild = ts.forEachChild;

/**
 * Kinds of pure type syntax, as a table because the walk asks for every node: what
 * `ts.isTypeNode` says, except an expression with type arguments (`extends Base<T>` runs `Base`).
 */
const TYPE_ONLY = new Uint8Array(K.Count);
for (let kind = 0; kind < TYPE_ONLY.length; kind++) {
  TYPE_ONLY[kind] = kind !== K.ExpressionWithTypeArguments && ts.isTypeNode({ kind } as ts.Node) ? 1 : 0;
}

/**
 * Kinds that may be a unit or name a scope (unitKind and scopeName say which), also as a table:
 * most nodes are neither, and one lookup spares them both switches (each case reads the
 * compiler's kind enum through a getter).
 */
const UNIT_OR_SCOPE = new Uint8Array(K.Count);
for (const kind of [K.FunctionDeclaration, K.FunctionExpression, K.ArrowFunction, K.MethodDeclaration, K.Constructor, K.GetAccessor, K.SetAccessor,
  K.ClassStaticBlockDeclaration, K.PropertyDeclaration, K.ClassDeclaration, K.ClassExpression, K.ModuleDeclaration, K.ObjectLiteralExpression]) {
  UNIT_OR_SCOPE[kind] = 1;
}

/** Where a run of nodes stands: the names around it (display and stable form) and its unit's node list. */
interface Scope {
  display: string[];
  stable: string[];
  nodes: ts.Node[];
}

/**
 * Every unit of the file, top-level code first, then in source order. The walk also links each
 * node to its parent: analyzeSource parses without the compiler's own linking pass, which walks
 * the tree once more and more slowly (docs/benchmarks.md); trees that already have parents (a
 * program's files) get the same links again.
 */
export function findUnits(sourceFile: ts.SourceFile, hasDecision: (field: ts.PropertyDeclaration) => boolean): FoundUnit[] {
  const topLevel: ts.Node[] = [sourceFile];
  const units: FoundUnit[] = [{ node: sourceFile, kind: 'top-level', name: '<top-level>', qualifiedName: '<top-level>', stableName: '<top-level>', nodes: topLevel }];
  // Two parallel stacks: the nodes still to visit (they come off in pre-order), and the scope each one stands in.
  const nodes: ts.Node[] = [];
  const scopes: Scope[] = [];
  pushChildren(nodes, scopes, sourceFile, { display: [], stable: [], nodes: topLevel });
  while (nodes.length > 0) {
    const node = nodes.pop()!;
    const scope = scopes.pop()!;
    // Types hold no code to run, so no units; their nodes are only linked and listed.
    if (TYPE_ONLY[node.kind] === 1) {
      linkAndList(node, scope.nodes);
      continue;
    }
    scope.nodes.push(node);
    if (UNIT_OR_SCOPE[node.kind] === 0) {
      pushChildren(nodes, scopes, node, scope);
      continue;
    }
    // Counting a field's decisions reads parents below it (an object literal's methods).
    if (node.kind === K.PropertyDeclaration) linkParents(node);
    const kind = unitKind(node, hasDecision);
    if (kind) {
      const own = unitName(node, sourceFile);
      const name = own ?? `${ANONYMOUS}@${sourceFile.getLineAndCharacterOfPosition(node.getStart(sourceFile)).line + 1}`;
      const qualifiedName = [...scope.display, name].join('.');
      const stableName = [...scope.stable, own ?? ANONYMOUS].join('.');
      const unitNodes = [node];
      units.push({ node, kind, name, qualifiedName, stableName, nodes: unitNodes });
      pushChildren(nodes, scopes, node, { display: [...scope.display, name], stable: [...scope.stable, own ?? ANONYMOUS], nodes: unitNodes });
    } else {
      const name = scopeName(node, sourceFile);
      pushChildren(nodes, scopes, node, name ? { display: [...scope.display, name], stable: [...scope.stable, name], nodes: scope.nodes } : scope);
    }
  }
  return units;
}

// Children are pushed in source order and then reversed, so they come off in source order.
function pushChildren(nodes: ts.Node[], scopes: Scope[], node: ts.Node, scope: Scope): void {
  const start = nodes.length;
  forEachChild(node, (child) => {
    (child as { parent: ts.Node }).parent = node;
    nodes.push(child);
    scopes.push(scope);
  });
  reverseFrom(nodes, start);
}

// Reverses `stack` from `start` on (the scopes pushed with a node's children are all the same).
function reverseFrom(stack: ts.Node[], start: number): void {
  for (let i = start, j = stack.length - 1; i < j; i++, j--) {
    const first = stack[i];
    stack[i] = stack[j];
    stack[j] = first;
  }
}

/** Links every node under `node` to its parent (iteratively: a field's initializer can be thousands deep). */
function linkParents(node: ts.Node): void {
  linkAndList(node, undefined);
}

/** Lists `root` and every node under it in pre-order, if `list` is given, linking each to its parent. */
function linkAndList(root: ts.Node, list: ts.Node[] | undefined): void {
  const stack: ts.Node[] = [root];
  while (stack.length > 0) {
    const node = stack.pop()!;
    list?.push(node);
    const start = stack.length;
    forEachChild(node, (child) => {
      (child as { parent: ts.Node }).parent = node;
      stack.push(child);
    });
    reverseFrom(stack, start);
  }
}

// A kind added to unitKind or scopeName must be added to UNIT_OR_SCOPE too.
function unitKind(node: ts.Node, hasDecision: (field: ts.PropertyDeclaration) => boolean): FunctionKind | undefined {
  switch (node.kind) {
    case K.FunctionDeclaration:
    case K.FunctionExpression:
      return (node as ts.FunctionLikeDeclaration).body ? 'function' : undefined;
    case K.ArrowFunction:
      return 'arrow';
    case K.MethodDeclaration:
      return (node as ts.MethodDeclaration).body ? 'method' : undefined;
    case K.Constructor:
      return (node as ts.ConstructorDeclaration).body ? 'constructor' : undefined;
    case K.GetAccessor:
      return (node as ts.GetAccessorDeclaration).body ? 'getter' : undefined;
    case K.SetAccessor:
      return (node as ts.SetAccessorDeclaration).body ? 'setter' : undefined;
    case K.ClassStaticBlockDeclaration:
      return 'static-block';
    case K.PropertyDeclaration: {
      const field = node as ts.PropertyDeclaration;
      return field.initializer && hasDecision(field) ? 'field-initializer' : undefined;
    }
    default:
      return undefined;
  }
}

/** Names that qualify the units inside them without being units themselves. */
function scopeName(node: ts.Node, sourceFile: ts.SourceFile): string | undefined {
  switch (node.kind) {
    case K.ClassDeclaration:
    case K.ClassExpression:
      return (node as ts.ClassLikeDeclaration).name?.text ?? unitName(node, sourceFile) ?? '<class>';
    case K.ModuleDeclaration:
      return propertyNameText((node as ts.ModuleDeclaration).name, sourceFile);
    case K.ObjectLiteralExpression:
      return unitName(node, sourceFile);
    default:
      return undefined;
  }
}
