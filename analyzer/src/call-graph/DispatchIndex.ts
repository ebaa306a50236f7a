/**
 * Dispatch through interfaces and abstract methods
 * ================================================
 * A call on a value typed by an interface, or on an abstract method, reaches whichever class
 * the value turns out to be. Candidates are the classes of the scanned code that declare they
 * implement or extend the interface or abstract class, directly or through other interfaces and
 * classes (`class C extends B`, `class B implements J`, `interface J extends I`); each one's
 * concrete member of the called name, own or inherited, is a target. Classes that merely have
 * the same shape are not followed: only declared heritage counts.
 *
 * Edge cases: members found only as bodiless declarations (abstract again, or ambient) give no
 * target; the same member reached through several subclasses is one target; an interface from
 * a package or the standard library is followed too when scanned classes implement it.
 *
 * [Reference]: class hierarchy analysis (Dean, Grove & Chambers, ECOOP 1995), restricted to
 * declared subtypes (from memory).
 */
import { ts } from '../compiler';
import type { UnitIndex } from './UnitIndex';

type HeritageOwner = ts.ClassLikeDeclaration | ts.InterfaceDeclaration;

export class DispatchIndex {
  private readonly owners: HeritageOwner[] = [];
  private subtypes: Map<ts.Symbol, HeritageOwner[]> | undefined;
  private readonly targets = new Map<ts.Node, string[]>();

  constructor(
    private readonly checker: ts.TypeChecker,
    private readonly units: UnitIndex,
  ) {}

  /** Records a class or interface of the scanned code that has `extends` or `implements`. */
  addOwner(node: HeritageOwner): void {
    this.owners.push(node);
    this.subtypes = undefined;
  }

  /** The member a call dispatches through, when the declaration is an interface member or an abstract method. */
  static dispatchMember(declaration: ts.Node): ts.Declaration | undefined {
    // `run: () => void` in an interface: the signature is the function type, the member its parent.
    const member = ts.isFunctionTypeNode(declaration) && ts.isPropertySignature(declaration.parent) ? declaration.parent : declaration;
    if (ts.isMethodSignature(member) || ts.isPropertySignature(member)) {
      const owner = member.parent;
      return ts.isInterfaceDeclaration(owner) || (ts.isTypeLiteralNode(owner) && ts.isTypeAliasDeclaration(owner.parent)) ? member : undefined;
    }
    if ((ts.isMethodDeclaration(member) || ts.isPropertyDeclaration(member) || ts.isGetAccessor(member) || ts.isSetAccessor(member)) && isAbstract(member)) return member;
    return undefined;
  }

  /** Unit ids of the concrete members a call through `member` may reach (empty when none is declared). */
  implementations(member: ts.Declaration): string[] {
    const cached = this.targets.get(member);
    if (cached) return cached;
    const found = this.find(member);
    this.targets.set(member, found);
    return found;
  }

  private find(member: ts.Declaration): string[] {
    const owner = ownerSymbol(member, this.checker);
    const memberName = ts.getNameOfDeclaration(member);
    const name = memberName && this.checker.getSymbolAtLocation(memberName);
    if (!owner || !name) return [];
    const ids = new Set<string>();
    const seen = new Set<ts.Symbol>([owner]);
    const pending = [owner];
    const subtypes = this.subtypeMap();
    while (pending.length > 0) {
      for (const sub of subtypes.get(pending.pop()!) ?? []) {
        if (ts.isClassLike(sub)) this.concreteMembers(sub, name.escapedName as string, ids);
        const symbol = symbolOfOwner(sub, this.checker);
        if (symbol && !seen.has(symbol)) {
          seen.add(symbol);
          pending.push(symbol);
        }
      }
    }
    return [...ids].sort();
  }

  private concreteMembers(cls: ts.ClassLikeDeclaration, name: string, into: Set<string>): void {
    const property = this.checker.getPropertyOfType(this.checker.getTypeAtLocation(cls), name);
    for (const declaration of property?.declarations ?? []) {
      const unit = this.units.unitOfDeclaration(declaration);
      if (unit) into.add(unit.id);
    }
  }

  private subtypeMap(): Map<ts.Symbol, HeritageOwner[]> {
    if (this.subtypes) return this.subtypes;
    const map = new Map<ts.Symbol, HeritageOwner[]>();
    for (const owner of this.owners) {
      for (const clause of owner.heritageClauses ?? []) {
        for (const type of clause.types) {
          const symbol = resolveAlias(this.checker.getSymbolAtLocation(type.expression), this.checker);
          if (!symbol) continue;
          const list = map.get(symbol);
          if (list) list.push(owner);
          else map.set(symbol, [owner]);
        }
      }
    }
    this.subtypes = map;
    return map;
  }
}

function isAbstract(node: ts.Declaration): boolean {
  return (ts.getCombinedModifierFlags(node) & ts.ModifierFlags.Abstract) !== 0;
}

function ownerSymbol(member: ts.Declaration, checker: ts.TypeChecker): ts.Symbol | undefined {
  const parent = member.parent;
  if (ts.isTypeLiteralNode(parent)) return ts.isTypeAliasDeclaration(parent.parent) ? checker.getSymbolAtLocation(parent.parent.name) : undefined;
  if (ts.isInterfaceDeclaration(parent) || ts.isClassLike(parent)) return symbolOfOwner(parent, checker);
  return undefined;
}

function symbolOfOwner(owner: HeritageOwner, checker: ts.TypeChecker): ts.Symbol | undefined {
  if (owner.name) return checker.getSymbolAtLocation(owner.name);
  // `export default class extends Base {}` has no name; the declaration's own symbol stands in.
  return (owner as unknown as { symbol?: ts.Symbol }).symbol;
}

/** Follows `import`/`export … from` aliases to the symbol they stand for. */
export function resolveAlias(symbol: ts.Symbol | undefined, checker: ts.TypeChecker): ts.Symbol | undefined {
  if (!symbol || !(symbol.flags & ts.SymbolFlags.Alias)) return symbol;
  const target = checker.getAliasedSymbol(symbol);
  return target.declarations?.length ? target : undefined;
}
