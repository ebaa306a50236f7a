import { syntheticFunction, syntheticSnapshot } from '../snapshot/fixtures/syntheticSnapshot';
import { functionsCsv, functionsCsvColumns } from './functionsCsv';

// A small RFC 4180 reader, written independently of the writer, to read the output back.
function readCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (c === '"') quoted = false;
      else cell += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      row.push(cell);
      cell = '';
    } else if (c === '\r' && text[i + 1] === '\n') {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
      i++;
    } else cell += c;
  }
  expect(cell).toBe('');
  expect(row).toEqual([]);
  return rows;
}

const BASE = ['id', 'file', 'qualifiedName', 'kind', 'line', 'endLine', 'loc', 'cyclomatic', 'cyclomaticStrict', 'decisions', 'essential', 'nodes', 'edges', 'overLimit'];

describe('functionsCsv', () => {
  const tricky = syntheticFunction({ cyclomatic: 12, line: 7, file: 'src/a, b.ts', qualifiedName: '=cmd|"x"' });
  const plain = syntheticFunction({ cyclomatic: 2, line: 40 });
  const snapshot = syntheticSnapshot([tricky, plain]);

  it('should write a header and one row per function that read back to the snapshot values', () => {
    const rows = readCsv([...functionsCsv(snapshot)].join(''));
    expect(rows[0]).toEqual(BASE);
    expect(rows).toHaveLength(3);
    const record = Object.fromEntries(BASE.map((name, i) => [name, rows[1][i]]));
    expect(record).toMatchObject({ file: 'src/a, b.ts', qualifiedName: `'=cmd|"x"`, line: '7', cyclomatic: '12', decisions: '11', overLimit: 'true' });
    expect(rows[2][BASE.indexOf('overLimit')]).toBe('false');
  });

  it('should add coverage columns only when the snapshot has coverage, leaving cells empty where a function has none', () => {
    expect(functionsCsvColumns(snapshot)).toEqual(BASE);
    const covered = syntheticSnapshot([
      { ...plain, coverage: { outcomesCovered: 1, outcomesTotal: 2, outcomes: [[true, false]], actualComplexity: 1, untestedPaths: 1, crap: 2.5 } },
      tricky,
    ]);
    covered.coverage = { format: 'lcov', unmatchedFiles: [] };
    const rows = readCsv([...functionsCsv(covered)].join(''));
    expect(rows[0].slice(BASE.length)).toEqual(['outcomesCovered', 'outcomesTotal', 'actualComplexity', 'untestedPaths', 'crap']);
    expect(rows[1].slice(BASE.length)).toEqual(['1', '2', '1', '1', '2.5']);
    expect(rows[2].slice(BASE.length)).toEqual(['', '', '', '', '']);
  });

  it('should use the snapshot limit for overLimit', () => {
    const lenient = syntheticSnapshot([tricky], { limit: 15 });
    expect(readCsv([...functionsCsv(lenient)].join(''))[1][BASE.indexOf('overLimit')]).toBe('false');
  });
});
