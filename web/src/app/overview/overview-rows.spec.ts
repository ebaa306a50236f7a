import { codebase, snapshot } from '../testing/api-fixtures';
import { overviewRows } from './overview-rows';

describe('overviewRows', () => {
  it('should give one row per snapshot, newest first, marking where each codebase starts', () => {
    const rows = overviewRows([
      codebase('dispatch-monolith', [snapshot({ id: 'new' }), snapshot({ id: 'old' })]),
      codebase('billing', [snapshot({ id: 'only' })]),
    ]);

    expect(rows.map((row) => [row.codebaseName, row.snapshot?.id, row.isFirstOfCodebase])).toEqual([
      ['dispatch-monolith', 'new', true],
      ['dispatch-monolith', 'old', false],
      ['billing', 'only', true],
    ]);
    expect(new Set(rows.map((row) => row.key)).size).toBe(3);
  });

  it('should keep a codebase without snapshots as one row without a snapshot', () => {
    const rows = overviewRows([codebase('tracking', [])]);

    expect(rows).toEqual([{ key: 'tracking', codebaseName: 'tracking', isFirstOfCodebase: true, snapshot: null }]);
  });

  it('should give no rows for no codebases', () => {
    expect(overviewRows([])).toEqual([]);
  });
});
