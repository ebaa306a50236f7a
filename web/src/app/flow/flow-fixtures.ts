import type { BasisPath, CompactGraph, FunctionDetail, FunctionRow } from './flow-types';

/**
 * Test data only: an invented function of Otterbay Parcel Co.'s dispatch code, its graph
 * (an `if` and a `while`: V(G) = 8 − 7 + 2 = 3) and its basis paths.
 */
export const LOAD_VAN_SOURCE = [
  'function loadVan(ready: boolean, queue: Parcel[]) {',
  '  if (ready) {',
  '    openDoors(); }',
  '  while (queue) {',
  '    stow(queue.pop());',
  '  }',
  '}',
].join('\n');

/** The graph of `loadVan`, on lines 2–8 of its file. */
export function loadVanGraph(): CompactGraph {
  return {
    entry: 0,
    exit: 6,
    blocks: [null, [2, 1, 2, 10], [3, 7, 3, 12], [4, 5, 4, 17], [5, 10, 5, 15], [6, 5, 6, 24], null],
    edges: [[0, 1], [1, 2], [2, 3, 0, 1], [2, 4, 0, 0], [3, 4], [4, 5, 1, 1], [4, 6, 1, 0], [5, 4]],
    decisions: [
      { kind: 'if', block: 2, span: { line: 3, column: 7, endLine: 3, endColumn: 12 }, text: 'ready' },
      { kind: 'while', block: 4, span: { line: 5, column: 10, endLine: 5, endColumn: 15 }, text: 'queue' },
    ],
  };
}

/** The three basis paths of `loadVan` (baseline first). */
export function loadVanPaths(): BasisPath[] {
  return [
    {
      index: 0,
      blocks: [0, 1, 2, 4, 6],
      edges: [0, 1, 3, 6],
      steps: [{ decision: 0, outcome: 'false' }, { decision: 1, outcome: 'false' }],
      description: ['line 3: if (ready) → false', 'line 5: while (queue) → leave loop'],
    },
    {
      index: 1,
      blocks: [0, 1, 2, 3, 4, 6],
      edges: [0, 1, 2, 4, 6],
      steps: [{ decision: 0, outcome: 'true' }, { decision: 1, outcome: 'false' }],
      description: ['line 3: if (ready) → true', 'line 5: while (queue) → leave loop'],
    },
    {
      index: 2,
      blocks: [0, 1, 2, 4, 5, 4, 6],
      edges: [0, 1, 3, 5, 7, 6],
      steps: [{ decision: 0, outcome: 'false' }, { decision: 1, outcome: 'true' }, { decision: 1, outcome: 'false' }],
      description: ['line 3: if (ready) → false', 'line 5: while (queue) → enter loop', 'line 5: while (queue) → leave loop'],
    },
  ];
}

/** The functions-table row of `loadVan`. */
export function loadVanRow(overrides: Partial<FunctionRow> = {}): FunctionRow {
  return {
    id: 'f-1',
    name: 'loadVan',
    qualifiedName: 'loadVan',
    kind: 'function',
    file: 'src/dispatch-core/loadVan.ts',
    folder: 'folder:src/dispatch-core',
    package: null,
    cluster: 'c1',
    line: 2,
    endLine: 8,
    loc: 7,
    cyclomatic: 3,
    cyclomaticStrict: 3,
    decisions: 2,
    nodes: 7,
    edges: 8,
    essential: 1,
    designComplexity: 2,
    fingerprint: 'a1b2c3',
    unresolvedCalls: 0,
    externalCalls: 0,
    band: 'calm',
    overLimit: false,
    outcomesCovered: null,
    outcomesTotal: null,
    actualComplexity: null,
    untestedPaths: null,
    crap: null,
    ...overrides,
  };
}

/** The API's answer for `loadVan`; override any part. */
export function loadVanDetail(overrides: Partial<FunctionDetail> = {}): FunctionDetail {
  return {
    function: loadVanRow(),
    graph: loadVanGraph(),
    formula: {
      edges: 8,
      nodes: 7,
      components: 1,
      strict: 3,
      decisions: 2,
      reported: 3,
      text: 'V(G) = E − N + 2P = 8 − 7 + 2 × 1 = 3; decisions + 1 = 2 + 1 = 3',
    },
    essential: { value: 1, irreducibleDecisions: [] },
    basisPaths: loadVanPaths(),
    gaps: { exitReachable: true, unreachableDecisions: [], trappedDecisions: [], trappedOutcomes: [] },
    coverage: null,
    source: LOAD_VAN_SOURCE,
    limit: 10,
    ...overrides,
  };
}
