/**
 * Calls of one file
 * =================
 * One walk over a scanned file's raw syntax (explicit stack) that finds, for each unit, its
 * call sites (calls, `new`, `super(…)`, tagged templates, bare decorators, JSX components,
 * getter and setter runs) with what each reaches, the functions it passes around as values
 * (reference edges), the scanned files the file imports, and the classes and interfaces that
 * declare heritage (for dispatch).
 *
 * Which unit a call belongs to follows the flow-graph builder (cfg/unitBoundaries.ts): the
 * innermost unit around it, except that decorators and computed names of a unit member belong
 * to the unit that defines the class or object. Type-only and ambient syntax is skipped.
 *
 * Edge cases: `require('x')` and `import('x')` are imports, not calls; intrinsic JSX elements
 * (`<div>`) run nothing; a function written inline as an argument is a unit of its own, not a
 * reference; only getters and setters declared in the scanned code are looked for, and only
 * through `obj.name` (not destructuring).
 *
 * [Reference]: unit boundaries as in cfg/unitBoundaries.ts; TypeScript's syntax kinds (common practice).
 */
import { ts } from '../compiler';
import { isTypeOrAmbient } from '../cfg/unitBoundaries';
import type { CallKind } from '../model';
import type { CallLike, CallResolver, CallTarget } from './CallResolver';
import type { UnitIndex } from './UnitIndex';

/** A place in the source that runs other code: 1-based line and column. */
export interface CallSite {
  line: number;
  column: number;
  /** Callee function ids; empty when the call reaches no unit of the scanned code. */
  to: string[];
}

/** One call site found in a file, with what it reaches. */
export interface SiteFact {
  from: string;
  kind: Exclude<CallKind, 'reference'>;
  site: CallSite;
  target: CallTarget;
}

/** What one file contributes to the call graph. */
export interface FileCalls {
  sites: SiteFact[];
  references: { from: string; to: string }[];
  /** Scanned files imported, deduplicated. */
  imports: string[];
  /** Classes and interfaces with `extends`/`implements`. */
  owners: (ts.ClassLikeDeclaration | ts.InterfaceDeclaration)[];
}

const K = ts.SyntaxKind;

/** Walks one scanned file; `file` is its posix path relative to the root. */
export function collectFileCalls(sourceFile: ts.SourceFile, file: string, units: UnitIndex, resolver: CallResolver): FileCalls {
  const out: FileCalls = { sites: [], references: [], imports: [], owners: [] };
  const imported = new Set<string>();
  const addImport = (specifier: ts.Expression | undefined) => {
    if (!specifier || !ts.isStringLiteralLike(specifier)) return;
    const to = resolver.importedFile(specifier);
    if (to !== undefined && to !== file && !imported.has(to)) {
      imported.add(to);
      out.imports.push(to);
    }
  };
  const addSite = (from: string, kind: SiteFact['kind'], at: ts.Node, target: CallTarget) => {
    const { line, character } = sourceFile.getLineAndCharacterOfPosition(at.getStart(sourceFile));
    out.sites.push({ from, kind, site: { line: line + 1, column: character + 1, to: [] }, target });
  };

  const top = units.unitAt(sourceFile)!.id;
  // Three parallel stacks: the node, the unit it runs in, and the unit around that unit.
  const nodes: ts.Node[] = [];
  const inUnit: string[] = [];
  const outerUnit: string[] = [];
  const push = (node: ts.Node, unit: string, outer: string) => {
    const start = nodes.length;
    ts.forEachChild(node, (child) => {
      nodes.push(child);
      inUnit.push(unit);
      outerUnit.push(outer);
    });
    reverseFrom(nodes, start);
    reverseFrom(inUnit, start);
    reverseFrom(outerUnit, start);
  };
  push(sourceFile, top, top);

  while (nodes.length > 0) {
    const node = nodes.pop()!;
    let unit = inUnit.pop()!;
    let outer = outerUnit.pop()!;
    const kind = node.kind;
    if (kind === K.InterfaceDeclaration) {
      if ((node as ts.InterfaceDeclaration).heritageClauses) out.owners.push(node as ts.InterfaceDeclaration);
      continue;
    }
    if (isTypeOrAmbient(node)) continue;
    const own = units.unitAt(node);
    if (own) {
      outer = unit;
      unit = own.id;
    } else if ((kind === K.Decorator || kind === K.ComputedPropertyName) && belongsOutside(node, units)) {
      unit = outer;
    }

    switch (kind) {
      case K.CallExpression: {
        const call = node as ts.CallExpression;
        const callee = call.expression;
        if (callee.kind === K.ImportKeyword || isRequire(call)) {
          addImport(call.arguments[0]);
          break;
        }
        addSite(unit, 'call', sitePlace(callee), resolver.resolveCall(call));
        break;
      }
      case K.NewExpression:
        addSite(unit, 'new', node, resolver.resolveCall(node as ts.NewExpression));
        break;
      case K.TaggedTemplateExpression:
        addSite(unit, 'call', (node as ts.TaggedTemplateExpression).tag, resolver.resolveCall(node as ts.TaggedTemplateExpression));
        break;
      case K.Decorator:
        // `@f()` is a call found below; a bare `@f` calls f itself.
        if (!ts.isCallExpression((node as ts.Decorator).expression)) addSite(unit, 'call', node, resolver.resolveCall(node as CallLike));
        break;
      case K.JsxOpeningElement:
      case K.JsxSelfClosingElement:
        if (!isIntrinsic((node as ts.JsxOpeningLikeElement).tagName)) addSite(unit, 'call', (node as ts.JsxOpeningLikeElement).tagName, resolver.resolveCall(node as CallLike));
        break;
      case K.ImportDeclaration:
      case K.ExportDeclaration:
        addImport((node as ts.ImportDeclaration | ts.ExportDeclaration).moduleSpecifier);
        continue;
      case K.ImportEqualsDeclaration: {
        const reference = (node as ts.ImportEqualsDeclaration).moduleReference;
        if (ts.isExternalModuleReference(reference)) addImport(reference.expression);
        continue;
      }
      case K.ClassDeclaration:
      case K.ClassExpression:
        if ((node as ts.ClassLikeDeclaration).heritageClauses) out.owners.push(node as ts.ClassLikeDeclaration);
        break;
      case K.PropertyAccessExpression: {
        const access = node as ts.PropertyAccessExpression;
        if (units.accessorNames.has(access.name.text) && !isCallee(access)) {
          const ids = resolver.accessorUnits(access);
          if (ids.length > 0) addSite(unit, 'call', access.name, { kind: 'units', ids });
        }
        break;
      }
      default:
        break;
    }
    if (isReferenceCandidate(node, units) && isValuePosition(node)) {
      const target = resolver.referencedUnit(node as ts.Expression);
      if (target) out.references.push({ from: unit, to: target.id });
    }
    push(node, unit, outer);
  }
  return out;
}

/** Decorators and computed names of a member that is a unit run where the class or object is defined. */
function belongsOutside(node: ts.Node, units: UnitIndex): boolean {
  let owner = node.parent;
  if (ts.isParameter(owner)) owner = owner.parent;
  return units.unitAt(owner) !== undefined;
}

/** Where a call is placed: the called name (`b` in `a.b()`), so a chain's calls get their own columns. */
function sitePlace(callee: ts.Expression): ts.Node {
  let node: ts.Expression = callee;
  while (ts.isParenthesizedExpression(node) || ts.isNonNullExpression(node)) node = node.expression;
  if (ts.isPropertyAccessExpression(node)) return node.name;
  if (ts.isElementAccessExpression(node)) return node.argumentExpression;
  return node;
}

function isRequire(call: ts.CallExpression): boolean {
  return ts.isIdentifier(call.expression) && call.expression.text === 'require' && call.arguments.length === 1 && ts.isStringLiteralLike(call.arguments[0]);
}

function isIntrinsic(tag: ts.JsxTagNameExpression): boolean {
  return (ts.isIdentifier(tag) && /^[a-z]|-/.test(tag.text)) || ts.isJsxNamespacedName(tag);
}

function isReferenceCandidate(node: ts.Node, units: UnitIndex): boolean {
  if (node.kind === K.Identifier) return units.referableNames.has((node as ts.Identifier).text);
  return node.kind === K.PropertyAccessExpression && units.referableNames.has((node as ts.PropertyAccessExpression).name.text);
}

function isCallee(node: ts.Node): boolean {
  const parent = node.parent;
  return (ts.isCallExpression(parent) || ts.isNewExpression(parent)) && parent.expression === node;
}

/**
 * Whether an identifier or property access stands where its value is handed on rather than
 * called: an argument, an initializer, the right side of `=`, a returned value, an arrow's
 * expression body, an object or array element, a JSX attribute, a branch of `?:`, or the
 * receiver of `.bind(…)`.
 */
function isValuePosition(node: ts.Node): boolean {
  const parent = node.parent;
  switch (parent.kind) {
    case K.CallExpression:
    case K.NewExpression:
      return (parent as ts.CallExpression).expression !== node;
    case K.VariableDeclaration:
    case K.PropertyDeclaration:
    case K.PropertyAssignment:
      return (parent as ts.VariableDeclaration).initializer === node;
    case K.BinaryExpression:
      return (parent as ts.BinaryExpression).right === node && (parent as ts.BinaryExpression).operatorToken.kind === K.EqualsToken;
    case K.ReturnStatement:
    case K.ArrayLiteralExpression:
    case K.JsxExpression:
    case K.ShorthandPropertyAssignment:
      return true;
    case K.ArrowFunction:
      return (parent as ts.ArrowFunction).body === node;
    case K.ConditionalExpression:
      return (parent as ts.ConditionalExpression).condition !== node;
    case K.PropertyAccessExpression:
      return (parent as ts.PropertyAccessExpression).expression === node && (parent as ts.PropertyAccessExpression).name.text === 'bind' && isCallee(parent);
    default:
      return false;
  }
}

function reverseFrom<T>(items: T[], start: number): void {
  for (let i = start, j = items.length - 1; i < j; i++, j--) {
    const t = items[i];
    items[i] = items[j];
    items[j] = t;
  }
}
