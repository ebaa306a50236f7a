import { DEFAULT_SETTINGS } from '../model';
import { syntheticFunction, syntheticSnapshot } from '../snapshot/fixtures/syntheticSnapshot';
import { shiftAfter, shiftBefore } from './fixtures/shiftPair';
import { IncomparableShiftError } from './IncomparableShiftError';
import { shiftSnapshots } from './shiftSnapshots';

// Worked by hand in docs/metrics/shift.md ("Worked example").
describe('shiftSnapshots on the worked example', () => {
  const shift = shiftSnapshots(shiftBefore(), shiftAfter());
  const row = (name: string) => shift.functions.find((f) => (f.after ?? f.before)!.qualifiedName === name)!;

  it.each([
    ['keep', 'same', 0, 0, null],
    ['grow', 'changed', 2, 2, null],
    ['gone', 'removed', -4, -3, null],
    ['fresh', 'renamed', 0, 0, null],
    ['edge', 'changed', 1, 1, 'up'],
    ['novel', 'added', 1, 0, null],
    ['big', 'changed', -3, -3, 'down'],
    ['mover', 'moved', 0, 0, null],
    ['extra', 'added', 3, 2, null],
  ])('should report %s as %s with ΔV %d and Δ decisions %d, crossing %s', (name, status, dv, dd, crossed) => {
    expect(row(name)).toMatchObject({ status, deltaCyclomatic: dv, deltaDecisions: dd, crossed });
  });

  it('should keep both sides of a renamed or moved function', () => {
    expect([row('fresh').before?.qualifiedName, row('fresh').after?.qualifiedName]).toEqual(['old', 'fresh']);
    expect([row('mover').before?.file, row('mover').after?.file]).toEqual(['src/b.ts', 'src/c.ts']);
    expect(shift.counts).toEqual({ same: 1, changed: 3, added: 2, removed: 1, moved: 1, renamed: 1 });
  });

  it('should take ΔΣV apart into Δ decisions and ΔP', () => {
    // Before: P 7, ΣV 36, Σ decisions 29; after: P 8, ΣV 36, Σ decisions 28.
    // ΔΣV = 0 = Δ decisions (−1) + ΔP (+1): one function more, one decision less.
    expect(shift.totals).toMatchObject({ deltaFunctions: 1, deltaCyclomatic: 0, deltaCyclomaticStrict: 0, deltaDecisions: -1, unexplained: 0, reportingDelta: 0 });
    // kept functions: grow +2, edge +1, big −3 = 0; added: novel 0 + extra 2; removed: gone −3.
    expect(shift.totals.decisionsFrom).toEqual({ kept: 0, added: 2, removed: -3 });
    expect([shift.totals.before.overLimit, shift.totals.after.overLimit]).toEqual([1, 1]);
  });

  it('should give the deltas per file and per folder', () => {
    const modules = Object.fromEntries(shift.modules.map((m) => [m.id, [m.deltaFunctions, m.deltaCyclomatic, m.deltaDecisions, m.crossed]]));
    expect(modules).toEqual({
      'file:lib/d.ts': [1, 3, 2, null],
      // a.ts: P 5 and ΣV 2+3+4+2+10 = 21 before, 2+5+2+11+1 = 21 after (so Σ decisions 16 both times);
      // its largest V goes 10 → 11.
      'file:src/a.ts': [0, 0, 0, 'up'],
      'file:src/b.ts': [-1, -6, -5, 'down'],
      'file:src/c.ts': [1, 3, 2, null],
      'folder:lib': [1, 3, 2, null],
      // src/: P 7 both times, ΣV 36 → 33 (extra went to lib/).
      'folder:src': [0, -3, -3, null],
    });
    expect(shift.crossed.modules.map((m) => m.id)).toEqual(['file:src/a.ts', 'file:src/b.ts']);
    expect(shift.crossed.functions.map((f) => f.after?.qualifiedName)).toEqual(['edge', 'big']);
  });
});

describe('shiftSnapshots edge cases', () => {
  it('should refuse snapshots counted under different settings, with a typed error', () => {
    const before = syntheticSnapshot([syntheticFunction({ cyclomatic: 2 })]);
    const after = syntheticSnapshot([syntheticFunction({ cyclomatic: 2 })], { switch: 'one', optionalChaining: true });
    expect(() => shiftSnapshots(before, after)).toThrow(IncomparableShiftError);
    try {
      shiftSnapshots(before, after);
    } catch (error) {
      expect((error as IncomparableShiftError).differences).toEqual(['switch: cases → one', 'optionalChaining: false → true']);
      expect((error as Error).message).toMatch(/^analyzer\/shift: /);
    }
  });

  it('should accept another limit and use the after snapshot’s for both sides', () => {
    const before = syntheticSnapshot([syntheticFunction({ cyclomatic: 12 })], { limit: 15 });
    const after = syntheticSnapshot([syntheticFunction({ cyclomatic: 12 })], { limit: 10 });
    const shift = shiftSnapshots(before, after);
    expect(shift.limit).toBe(10);
    expect(shift.functions[0]).toMatchObject({ status: 'same', crossed: null });
    expect([shift.totals.before.overLimit, shift.totals.after.overLimit]).toEqual([1, 1]);
  });

  it('should report the --switch one difference beside the identity', () => {
    // A function with a three-case switch and one if: 4 decisions, strict V 5, reported 5 − (3 − 1) = 3
    // (NIST SP 500-235 §4.1: each case a decision; the `one` convention counts the switch once).
    const settings = { ...DEFAULT_SETTINGS, switch: 'one' as const };
    const before = syntheticSnapshot([syntheticFunction({ cyclomatic: 1, qualifiedName: 'a' })], settings);
    const switched = syntheticFunction({ cyclomatic: 5, qualifiedName: 'b' });
    const after = syntheticSnapshot([syntheticFunction({ cyclomatic: 1, qualifiedName: 'a' }), { ...switched, cyclomatic: 3 }], settings);
    const { totals } = shiftSnapshots(before, after);
    expect(totals).toMatchObject({ deltaCyclomatic: 3, deltaCyclomaticStrict: 5, deltaDecisions: 4, deltaFunctions: 1, unexplained: 0, reportingDelta: 2 });
  });

  it('should prefer a move over a rename, and match each function at most once', () => {
    const body = { fingerprint: 'same-body' };
    const before = syntheticSnapshot([syntheticFunction({ cyclomatic: 2, file: 'a.ts', qualifiedName: 'f', ...body }), syntheticFunction({ cyclomatic: 2, file: 'x.ts', qualifiedName: 'f', ...body })]);
    const after = syntheticSnapshot([syntheticFunction({ cyclomatic: 2, file: 'a.ts', qualifiedName: 'g', ...body }), syntheticFunction({ cyclomatic: 2, file: 'b.ts', qualifiedName: 'f', ...body })]);
    const statuses = shiftSnapshots(before, after).functions.map((f) => [f.status, f.before?.file ?? null, f.after?.file ?? null]);
    // a.ts#f has both a same-name copy in b.ts (moved) and a renamed copy in a.ts: the move wins;
    // x.ts#f then finds no free same-name copy and no copy in its own file.
    expect(statuses).toEqual([['added', null, 'a.ts'], ['moved', 'a.ts', 'b.ts'], ['removed', 'x.ts', null]]);
  });

  it('should follow a function whose ordinal moved because a same-named one was added above it', () => {
    const anon = (ordinal: number, fingerprint: string, cyclomatic: number) => ({ ...syntheticFunction({ cyclomatic, file: 'a.ts', qualifiedName: '<anonymous>', fingerprint }), id: `a.ts#<anonymous>#${ordinal}` });
    const before = syntheticSnapshot([anon(0, 'old-body', 3)]);
    const after = syntheticSnapshot([anon(0, 'new-body', 1), anon(1, 'old-body', 3)]);
    expect(shiftSnapshots(before, after).functions.map((f) => [f.status, f.before?.id ?? null, f.after?.id])).toEqual([
      ['added', null, 'a.ts#<anonymous>#0'],
      ['same', 'a.ts#<anonymous>#0', 'a.ts#<anonymous>#1'],
    ]);
  });

  it('should put root files in the folder module "."', () => {
    const shift = shiftSnapshots(syntheticSnapshot([]), syntheticSnapshot([syntheticFunction({ cyclomatic: 1, file: 'index.ts' })]));
    expect(shift.modules.map((m) => m.id)).toEqual(['file:index.ts', 'folder:.']);
  });
});
