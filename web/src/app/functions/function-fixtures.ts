import type { FunctionPage, FunctionRow } from './functions-types';

/** Test data only: functions of the invented Otterbay Parcel Co. dispatch monolith. */

/** A function row; override any field. */
export function functionRow(overrides: Partial<FunctionRow> = {}): FunctionRow {
  return {
    id: 'fn-plan',
    name: 'planDispatch',
    qualifiedName: 'planDispatch',
    kind: 'function',
    file: 'src/dispatch-core/planDispatch.ts',
    folder: 'folder:src/dispatch-core',
    package: null,
    cluster: 'c1',
    line: 23,
    endLine: 126,
    loc: 96,
    cyclomatic: 41,
    cyclomaticStrict: 41,
    decisions: 40,
    nodes: 86,
    edges: 125,
    essential: 17,
    designComplexity: 30,
    fingerprint: '8d15af0b1ca65400',
    unresolvedCalls: 0,
    externalCalls: 9,
    band: 'tangled',
    overLimit: true,
    outcomesCovered: null,
    outcomesTotal: null,
    actualComplexity: null,
    untestedPaths: null,
    crap: null,
    ...overrides,
  };
}

/** A page of functions; `total` defaults to the number of items. */
export function functionPage(items: FunctionRow[], overrides: Partial<FunctionPage> = {}): FunctionPage {
  return { items, total: items.length, page: 1, pageSize: 50, sort: 'cyclomatic', order: 'desc', limit: 10, ...overrides };
}

/** `count` small rows with ids `fn-<offset + i>`. */
export function manyRows(count: number, offset = 0): FunctionRow[] {
  return Array.from({ length: count }, (_, i) =>
    functionRow({ id: `fn-${offset + i}`, name: `step${offset + i}`, qualifiedName: `step${offset + i}`, cyclomatic: 2, band: 'calm', overLimit: false }),
  );
}
