/**
 * Resolving one call
 * ==================
 * Asks the type checker what a call, `new`, tagged template, decorator or JSX element runs and
 * turns the answer into targets: units of the scanned code, a dispatch through an interface or
 * abstract member (decided once every class is known), an external package, nothing that can
 * be known (unresolved), or scanned code that runs no unit (a class without a constructor).
 *
 * Order: the resolved signature's declaration first (it already sees through imports,
 * re-exports, namespaces, aliases and overloads); when that is only a type (`const f: Fn = …`,
 * an interface member) the callee's symbol, followed through aliases, to the value it holds;
 * then dispatch; then where the declaration lives. `f.call(…)` / `f.apply(…)` call `f`.
 *
 * Edge cases: a callee of type `any` has no declaration and is unresolved, as is a call through
 * a function-typed value declared in the scanned code (a callback parameter: its target is not
 * known statically); ambient `declare` code in a scanned file is external, grouped by its file.
 *
 * [Reference]: TypeScript compiler API, `TypeChecker.getResolvedSignature`, `getSymbolAtLocation`,
 * `getAliasedSymbol` (common practice).
 */
import { ts } from '../compiler';
import { DispatchIndex, resolveAlias } from './DispatchIndex';
import { packageOfFile, STANDARD_LIBRARY } from './externalPackage';
import { skipWrappers, type IndexedUnit, type UnitIndex } from './UnitIndex';

/** What a call reaches. */
export type CallTarget =
  | { kind: 'units'; ids: string[] }
  | { kind: 'dispatch'; member: ts.Declaration }
  | { kind: 'external'; group: string }
  | { kind: 'unresolved' }
  | { kind: 'internal' };

/** Nodes that run a function. */
export type CallLike = ts.CallExpression | ts.NewExpression | ts.TaggedTemplateExpression | ts.Decorator | ts.JsxOpeningLikeElement;

// NodeFlags.Ambient is set by the parser on `declare` code; the public typings hide it.
const AMBIENT = (ts.NodeFlags as unknown as { Ambient?: number }).Ambient ?? 1 << 25;
const UNRESOLVED: CallTarget = { kind: 'unresolved' };
const INTERNAL: CallTarget = { kind: 'internal' };

export class CallResolver {
  private readonly bySymbol = new Map<ts.Symbol, IndexedUnit | null>();
  private readonly functionBySymbol = new Map<ts.Symbol, IndexedUnit | null>();
  private readonly groups = new Map<ts.SourceFile, string | null>();

  constructor(
    private readonly program: ts.Program,
    private readonly checker: ts.TypeChecker,
    private readonly units: UnitIndex,
    /** Scanned source files and their posix paths relative to the root. */
    private readonly scanned: ReadonlyMap<ts.SourceFile, string>,
    private readonly root: string,
  ) {}

  /** What `node` calls. */
  resolveCall(node: CallLike): CallTarget {
    const declaration = this.checker.getResolvedSignature(node)?.declaration;
    const group = declaration && this.groupOf(declaration.getSourceFile());
    if (declaration && group === undefined) {
      const unit = this.units.unitOfDeclaration(declaration);
      if (unit) return { kind: 'units', ids: [unit.id] };
    }
    // A function or method declared outside: external, unless it is only a type our own value may carry.
    if (group !== undefined && !isSignatureType(declaration!)) return { kind: 'external', group };
    // A callee of type `any` leads nowhere (the bulk of unresolved calls in JavaScript).
    if (!declaration && ts.isCallExpression(node) && this.checker.getTypeAtLocation(node.expression).flags & ts.TypeFlags.Any) return UNRESOLVED;
    const symbol = this.calleeSymbol(node);
    const unit = symbol && this.unitOfSymbol(symbol, true);
    if (unit) return { kind: 'units', ids: [unit.id] };
    if (group === STANDARD_LIBRARY) {
      const called = this.callOrApply(node);
      if (called) return called;
    }
    const member = (declaration && DispatchIndex.dispatchMember(declaration)) ?? firstDispatchMember(symbol);
    if (member) return { kind: 'dispatch', member };
    const place = declaration ?? resolveAlias(symbol, this.checker)?.declarations?.[0];
    return place ? this.byPlace(place) : UNRESOLVED;
  }

  /** Where a dispatch with no implementing class ends: external when declared outside, else unresolved. */
  withoutImplementations(member: ts.Declaration): CallTarget {
    const group = this.groupOf(member.getSourceFile());
    return group === undefined ? UNRESOLVED : { kind: 'external', group };
  }

  /** The function unit an identifier or property access refers to, if it refers to one. */
  referencedUnit(expression: ts.Expression): IndexedUnit | undefined {
    const node = skipWrappers(expression);
    const name = ts.isPropertyAccessExpression(node) ? node.name : ts.isIdentifier(node) ? node : undefined;
    if (!name) return undefined;
    const symbol =
      ts.isShorthandPropertyAssignment(node.parent) && node.parent.name === node
        ? this.checker.getShorthandAssignmentValueSymbol(node.parent)
        : this.checker.getSymbolAtLocation(name);
    const unit = symbol && this.unitOfSymbol(symbol, false);
    // Reading a getter runs it (a call, found elsewhere); it hands no function on.
    return unit && unit.kind !== 'getter' && unit.kind !== 'setter' ? unit : undefined;
  }

  /** The getter and/or setter units a property access runs (`p += 1` runs both). */
  accessorUnits(access: ts.PropertyAccessExpression): string[] {
    const symbol = this.checker.getSymbolAtLocation(access.name);
    if (!symbol || !(symbol.flags & ts.SymbolFlags.Accessor)) return [];
    const { reads, writes } = accessorUse(access);
    const ids: string[] = [];
    for (const declaration of symbol.declarations ?? []) {
      if ((ts.isGetAccessor(declaration) && reads) || (ts.isSetAccessor(declaration) && writes)) {
        const unit = this.units.unitOfDeclaration(declaration);
        if (unit) ids.push(unit.id);
      }
    }
    return ids;
  }

  /** The scanned file an import's module specifier resolves to, if any. */
  importedFile(specifier: ts.Expression): string | undefined {
    const symbol = this.checker.getSymbolAtLocation(specifier);
    const file = symbol?.declarations?.find(ts.isSourceFile);
    return file && this.scanned.get(file);
  }

  private callOrApply(node: CallLike): CallTarget | undefined {
    if (!ts.isCallExpression(node)) return undefined;
    const callee = skipWrappers(node.expression);
    if (!ts.isPropertyAccessExpression(callee) || (callee.name.text !== 'call' && callee.name.text !== 'apply')) return undefined;
    const unit = this.referencedUnit(callee.expression);
    return unit && { kind: 'units', ids: [unit.id] };
  }

  private calleeSymbol(node: CallLike): ts.Symbol | undefined {
    let callee: ts.Node;
    if (ts.isCallExpression(node) || ts.isNewExpression(node) || ts.isDecorator(node)) callee = node.expression;
    else if (ts.isTaggedTemplateExpression(node)) callee = node.tag;
    else callee = node.tagName;
    callee = skipWrappers(callee);
    if (callee.kind === ts.SyntaxKind.SuperKeyword) return this.baseClassSymbol(callee);
    // `(0, mod.f)(…)`, as compilers write calls to imported functions.
    if (ts.isBinaryExpression(callee) && callee.operatorToken.kind === ts.SyntaxKind.CommaToken) callee = skipWrappers(callee.right);
    if (ts.isPropertyAccessExpression(callee)) return this.checker.getSymbolAtLocation(callee.name);
    if (ts.isElementAccessExpression(callee)) {
      return ts.isStringLiteralLike(callee.argumentExpression) ? this.checker.getSymbolAtLocation(callee.argumentExpression) : undefined;
    }
    return this.checker.getSymbolAtLocation(callee);
  }

  /** `super(…)` into a base class with no constructor: the base class itself. */
  private baseClassSymbol(node: ts.Node): ts.Symbol | undefined {
    let current: ts.Node | undefined = node.parent;
    while (current && !ts.isClassLike(current)) current = current.parent;
    const base = current?.heritageClauses?.find((c) => c.token === ts.SyntaxKind.ExtendsKeyword)?.types[0];
    return base && this.checker.getSymbolAtLocation(base.expression);
  }

  /** The unit a symbol stands for; a class stands for its constructor only when it is called (`new`). */
  private unitOfSymbol(symbol: ts.Symbol, called: boolean): IndexedUnit | undefined {
    const cache = called ? this.bySymbol : this.functionBySymbol;
    const cached = cache.get(symbol);
    if (cached !== undefined) return cached ?? undefined;
    const target = resolveAlias(symbol, this.checker);
    let found: IndexedUnit | undefined;
    for (const declaration of target?.declarations ?? []) {
      found = this.units.unitOfDeclaration(declaration) ?? (called ? this.units.constructorOf(declaration) : undefined);
      if (found) break;
    }
    cache.set(symbol, found ?? null);
    return found;
  }

  private byPlace(declaration: ts.Node): CallTarget {
    const group = this.groupOf(declaration.getSourceFile());
    if (group !== undefined) return { kind: 'external', group };
    if (declaration.flags & AMBIENT) return { kind: 'external', group: this.scanned.get(declaration.getSourceFile())! };
    return ts.isClassLike(declaration) ? INTERNAL : UNRESOLVED;
  }

  /** The external group of a file, or undefined for a scanned file. */
  private groupOf(file: ts.SourceFile): string | undefined {
    const cached = this.groups.get(file);
    if (cached !== undefined) return cached ?? undefined;
    let group: string | undefined;
    if (!this.scanned.has(file)) {
      if (this.program.isSourceFileDefaultLibrary(file)) group = STANDARD_LIBRARY;
      else group = packageOfFile(file.fileName) ?? relativeTo(this.root, file.fileName);
    }
    this.groups.set(file, group ?? null);
    return group;
  }
}

/** Declarations that only give a type: the value called may be any function of that type. */
function isSignatureType(declaration: ts.Node): boolean {
  switch (declaration.kind) {
    case ts.SyntaxKind.MethodSignature:
    case ts.SyntaxKind.PropertySignature:
    case ts.SyntaxKind.CallSignature:
    case ts.SyntaxKind.ConstructSignature:
    case ts.SyntaxKind.FunctionType:
    case ts.SyntaxKind.ConstructorType:
    case ts.SyntaxKind.JSDocFunctionType:
    case ts.SyntaxKind.JSDocSignature:
      return true;
    default:
      return false;
  }
}

function firstDispatchMember(symbol: ts.Symbol | undefined): ts.Declaration | undefined {
  for (const declaration of symbol?.declarations ?? []) {
    const member = DispatchIndex.dispatchMember(declaration);
    if (member) return member;
  }
  return undefined;
}

function accessorUse(access: ts.Node): { reads: boolean; writes: boolean } {
  let node = access;
  while (ts.isParenthesizedExpression(node.parent) || ts.isNonNullExpression(node.parent)) node = node.parent;
  const parent = node.parent;
  if (ts.isBinaryExpression(parent) && parent.left === node) {
    const operator = parent.operatorToken.kind;
    if (operator === ts.SyntaxKind.EqualsToken) return { reads: false, writes: true };
    if (operator >= ts.SyntaxKind.FirstCompoundAssignment && operator <= ts.SyntaxKind.LastCompoundAssignment) return { reads: true, writes: true };
  }
  if ((ts.isPrefixUnaryExpression(parent) || ts.isPostfixUnaryExpression(parent)) && (parent.operator === ts.SyntaxKind.PlusPlusToken || parent.operator === ts.SyntaxKind.MinusMinusToken)) {
    return { reads: true, writes: true };
  }
  return { reads: true, writes: false };
}

function relativeTo(root: string, fileName: string): string {
  const prefix = root.endsWith('/') ? root : `${root}/`;
  if (fileName.startsWith(prefix)) return fileName.slice(prefix.length);
  // Outside the scanned folder: count it by a path relative to the root all the same.
  const from = prefix.split('/').filter(Boolean);
  const to = fileName.split('/').filter(Boolean);
  let common = 0;
  while (common < from.length && common < to.length && from[common] === to[common]) common++;
  return [...from.slice(common).map(() => '..'), ...to.slice(common)].join('/');
}
