/**
 * Units by declaration
 * ====================
 * Finds the units of every scanned file of a program with the same rules and ids as
 * analyzeSource (findUnits; ordinal per stable name in discovery order; unitId), and maps a
 * declaration the checker points at to the unit it IS: the function itself, the function or
 * arrow a variable, property or `a.b = …` assignment holds, the implementation behind overload
 * signatures, or a class's constructor.
 *
 * [Reference]: analyzeSource.ts (ids), units/findUnits.ts (units).
 */
import { ts } from '../compiler';
import { countDecisions } from '../decisions/countDecisions';
import type { CountingSettings, FunctionKind } from '../model';
import { findUnits } from '../units/findUnits';
import { unitId } from '../units/unitId';

/** One unit of a scanned file, with the id analyzeSource gives it. */
export interface IndexedUnit {
  id: string;
  kind: FunctionKind;
  /** The unit's own name, e.g. `run`, `constructor`, `<anonymous>`. */
  name: string;
}

// Units a value can refer to and call: not top-level code, static blocks or field initialisers.
const CALLABLE: ReadonlySet<FunctionKind> = new Set<FunctionKind>(['function', 'arrow', 'method', 'constructor', 'getter', 'setter']);

export class UnitIndex {
  private readonly units = new Map<ts.Node, IndexedUnit>();
  /** Names of the getters and setters in scanned files: only such property reads can run one. */
  readonly accessorNames = new Set<string>();
  /**
   * Names a reference to one of our functions can carry: the functions' own names (last part of
   * `a.b`) and every name an import binds. Other identifiers are not looked up (a large saving).
   */
  readonly referableNames = new Set<string>();

  constructor(private readonly checker: ts.TypeChecker) {}

  /** Indexes one scanned file's units; returns them, top-level code first. */
  addFile(sourceFile: ts.SourceFile, file: string, settings: CountingSettings): { node: ts.Node; unit: IndexedUnit }[] {
    const found = findUnits(sourceFile, (field) => countDecisions(field, sourceFile, settings).total > 0);
    const ordinals = new Map<string, number>();
    const indexed = found.map((u) => {
      const ordinal = ordinals.get(u.stableName) ?? 0;
      ordinals.set(u.stableName, ordinal + 1);
      const unit: IndexedUnit = { id: unitId(file, u.stableName, ordinal), kind: u.kind, name: u.name };
      this.units.set(u.node, unit);
      if (u.kind === 'getter' || u.kind === 'setter') this.accessorNames.add(u.name);
      else if (CALLABLE.has(u.kind)) {
        this.referableNames.add(u.name.slice(u.name.lastIndexOf('.') + 1));
        // `const f = function g() {}` is referred to as f.
        const holder = holderName(u.node);
        if (holder) this.referableNames.add(holder);
      }
      return { node: u.node, unit };
    });
    this.addImportedNames(sourceFile);
    return indexed;
  }

  private addImportedNames(sourceFile: ts.SourceFile): void {
    for (const statement of sourceFile.statements) {
      if (ts.isImportEqualsDeclaration(statement)) this.referableNames.add(statement.name.text);
      if (!ts.isImportDeclaration(statement) || !statement.importClause) continue;
      const { name, namedBindings } = statement.importClause;
      if (name) this.referableNames.add(name.text);
      if (namedBindings && ts.isNamespaceImport(namedBindings)) this.referableNames.add(namedBindings.name.text);
      else if (namedBindings) for (const element of namedBindings.elements) this.referableNames.add(element.name.text);
    }
  }

  /** The unit whose node this is, if any. */
  unitAt(node: ts.Node): IndexedUnit | undefined {
    return this.units.get(node);
  }

  /** The callable unit a declaration stands for, or undefined when it is no unit of ours. */
  unitOfDeclaration(declaration: ts.Node): IndexedUnit | undefined {
    const node = this.implementationOf(declaration) ?? valueOf(declaration);
    const unit = node && this.units.get(node);
    return unit && CALLABLE.has(unit.kind) ? unit : undefined;
  }

  /** The constructor unit of a class declaration or expression, if it has one with a body. */
  constructorOf(declaration: ts.Node): IndexedUnit | undefined {
    if (!ts.isClassLike(declaration)) return undefined;
    const ctor = declaration.members.find((m) => ts.isConstructorDeclaration(m) && m.body !== undefined);
    return ctor && this.units.get(ctor);
  }

  /** For a bodiless overload signature in our code: the declaration with the body. */
  private implementationOf(declaration: ts.Node): ts.Node | undefined {
    if (this.units.has(declaration)) return declaration;
    if (ts.isConstructorDeclaration(declaration) && !declaration.body) {
      return declaration.parent.members.find((m) => ts.isConstructorDeclaration(m) && m.body !== undefined);
    }
    if ((ts.isFunctionDeclaration(declaration) || ts.isMethodDeclaration(declaration)) && !declaration.body && declaration.name) {
      const symbol = this.checker.getSymbolAtLocation(declaration.name);
      return symbol?.declarations?.find((d) => this.units.has(d));
    }
    return undefined;
  }
}

/** The name of the variable, property or assignment target holding a function expression. */
function holderName(node: ts.Node): string | undefined {
  if (!ts.isFunctionExpression(node) || !node.name) return undefined;
  let parent = node.parent;
  while (ts.isParenthesizedExpression(parent) || ts.isAsExpression(parent) || ts.isSatisfiesExpression(parent)) parent = parent.parent;
  let target: ts.Node | undefined;
  if (ts.isVariableDeclaration(parent) || ts.isPropertyAssignment(parent) || ts.isPropertyDeclaration(parent)) target = parent.name;
  else if (ts.isBinaryExpression(parent) && parent.operatorToken.kind === ts.SyntaxKind.EqualsToken) target = ts.isPropertyAccessExpression(parent.left) ? parent.left.name : parent.left;
  return target && ts.isIdentifier(target) ? target.text : undefined;
}

/** The function expression a declaration holds: `const f = () => …`, `{ f: function () {} }`, `a.b = …`. */
function valueOf(declaration: ts.Node): ts.Node | undefined {
  let value: ts.Node | undefined;
  if (ts.isVariableDeclaration(declaration) || ts.isPropertyDeclaration(declaration) || ts.isPropertyAssignment(declaration)) value = declaration.initializer;
  else if (ts.isExportAssignment(declaration)) value = declaration.expression;
  else if (ts.isBinaryExpression(declaration)) value = declaration.right;
  else if ((ts.isPropertyAccessExpression(declaration) || ts.isElementAccessExpression(declaration) || ts.isIdentifier(declaration)) && isAssignmentTarget(declaration)) {
    value = (declaration.parent as ts.BinaryExpression).right;
  }
  return value && skipWrappers(value);
}

function isAssignmentTarget(node: ts.Node): boolean {
  const parent = node.parent;
  return !!parent && ts.isBinaryExpression(parent) && parent.left === node && parent.operatorToken.kind === ts.SyntaxKind.EqualsToken;
}

/** `(f)`, `f as T`, `f!`, `<T>f` and `f satisfies T` are all `f`. */
export function skipWrappers(node: ts.Node): ts.Node {
  let current = node;
  while (
    ts.isParenthesizedExpression(current) ||
    ts.isAsExpression(current) ||
    ts.isSatisfiesExpression(current) ||
    ts.isNonNullExpression(current) ||
    ts.isTypeAssertionExpression(current)
  ) {
    current = current.expression;
  }
  return current;
}
