import type { FunctionRecord } from '../model';
import { syntheticFunction, syntheticSnapshot } from '../snapshot/fixtures/syntheticSnapshot';
import { countingDifferences } from './countingDifferences';
import { findBreaches } from './findBreaches';
import { IncomparableSnapshotsError } from './IncomparableSnapshotsError';

const fn = (qualifiedName: string, cyclomatic: number, extra: Partial<FunctionRecord> = {}) =>
  syntheticFunction({ qualifiedName, cyclomatic, line: extra.line ?? 1, ...extra });

const names = (report: ReturnType<typeof findBreaches>) => report.breaches.map((b) => `${b.function.qualifiedName}:${b.reason}`);

describe('findBreaches without a baseline', () => {
  it('should list exactly the functions whose V(G) is above the limit, largest first', () => {
    // McCabe 1976, IEEE TSE SE-2(4): V = 10 is at the limit, not over it.
    const snapshot = syntheticSnapshot([fn('atLimit', 10), fn('small', 3), fn('big', 25), fn('over', 11)]);
    expect(names(findBreaches(snapshot, { limit: 10 }))).toEqual(['big:over-limit', 'over:over-limit']);
  });

  it('should honour another limit', () => {
    const snapshot = syntheticSnapshot([fn('a', 10), fn('b', 16)]);
    expect(names(findBreaches(snapshot, { limit: 15 }))).toEqual(['b:over-limit']);
    expect(names(findBreaches(snapshot, { limit: 5 }))).toEqual(['b:over-limit', 'a:over-limit']);
  });

  it('should order equal V(G) by file, then line', () => {
    const snapshot = syntheticSnapshot([
      fn('z2', 12, { file: 'b.ts', line: 9 }),
      fn('z1', 12, { file: 'b.ts', line: 3 }),
      fn('a', 12, { file: 'a.ts', line: 50 }),
    ]);
    expect(findBreaches(snapshot, { limit: 10 }).breaches.map((b) => `${b.function.file}:${b.function.line}`)).toEqual(['a.ts:50', 'b.ts:3', 'b.ts:9']);
  });
});

describe('findBreaches with a baseline', () => {
  it('should report new, risen-above and risen-further functions and tolerate the unchanged and improved', () => {
    const baseline = syntheticSnapshot([fn('same', 14), fn('better', 20), fn('crossed', 9), fn('worse', 12)]);
    const current = syntheticSnapshot([fn('same', 14), fn('better', 13), fn('crossed', 11), fn('worse', 13), fn('fresh', 11)]);
    const report = findBreaches(current, { limit: 10, baseline });
    expect(names(report)).toEqual(['worse:rose-further', 'crossed:rose-above', 'fresh:new']);
    expect(report.breaches.map((b) => b.previousCyclomatic)).toEqual([12, 9, undefined]);
    expect(report.tolerated).toBe(2);
  });

  it('should match a moved function by its fingerprint and not call it new', () => {
    const before = fn('Orders.assign', 15, { file: 'src/orders.ts' });
    const moved = { ...before, id: 'src/dispatch.ts#Dispatch.assign#0', file: 'src/dispatch.ts', qualifiedName: 'Dispatch.assign' };
    const report = findBreaches(syntheticSnapshot([moved]), { limit: 10, baseline: syntheticSnapshot([before]) });
    expect(report.breaches).toEqual([]);
    expect(report.tolerated).toBe(1);
  });

  it('should report a moved function that also grew, saying where it came from', () => {
    const before = fn('Orders.assign', 15, { fingerprint: 'same-body' });
    const moved = fn('Dispatch.assign', 17, { file: 'src/dispatch.ts', fingerprint: 'same-body' });
    const [breach] = findBreaches(syntheticSnapshot([moved]), { limit: 10, baseline: syntheticSnapshot([before]) }).breaches;
    expect(breach).toMatchObject({ reason: 'rose-further', previousCyclomatic: 15, movedFrom: before.id });
  });

  it('should not match by fingerprint a baseline function that still exists under its id', () => {
    const kept = fn('kept', 12, { fingerprint: 'twin' });
    const copy = fn('copy', 12, { fingerprint: 'twin', line: 40 });
    const report = findBreaches(syntheticSnapshot([kept, copy]), { limit: 10, baseline: syntheticSnapshot([kept]) });
    expect(names(report)).toEqual(['copy:new']);
  });

  it('should match each moved baseline function at most once', () => {
    const gone = fn('gone', 12, { fingerprint: 'twin' });
    const a = fn('a', 12, { fingerprint: 'twin', line: 5 });
    const b = fn('b', 12, { fingerprint: 'twin', line: 50 });
    const report = findBreaches(syntheticSnapshot([a, b]), { limit: 10, baseline: syntheticSnapshot([gone]) });
    expect(names(report)).toEqual(['b:new']);
  });

  it('should judge against the given limit, not the snapshots\' own', () => {
    const baseline = syntheticSnapshot([fn('f', 13)], { limit: 10 });
    const current = syntheticSnapshot([fn('f', 13)], { limit: 10 });
    expect(names(findBreaches(current, { limit: 12, baseline }))).toEqual([]);
    expect(names(findBreaches(syntheticSnapshot([fn('f', 14)]), { limit: 15, baseline }))).toEqual([]);
  });

  it('should refuse a baseline counted under other settings', () => {
    const baseline = syntheticSnapshot([fn('f', 12)], { switch: 'one' });
    const current = syntheticSnapshot([fn('f', 12)], { optionalChaining: true });
    expect(() => findBreaches(current, { limit: 10, baseline })).toThrow(IncomparableSnapshotsError);
    expect(() => findBreaches(current, { limit: 10, baseline })).toThrow(/switch: one → cases; optionalChaining: false → true/);
  });

  it('should accept a baseline that differs only in its limit', () => {
    const baseline = syntheticSnapshot([fn('f', 12)], { limit: 15 });
    expect(() => findBreaches(syntheticSnapshot([fn('f', 12)]), { limit: 10, baseline })).not.toThrow();
  });
});

describe('countingDifferences', () => {
  it('should name each differing counting setting and ignore the limit', () => {
    const base = { switch: 'cases', optionalChaining: false, defaultValues: false, limit: 10 } as const;
    expect(countingDifferences(base, { ...base, limit: 20 })).toEqual([]);
    expect(countingDifferences(base, { ...base, defaultValues: true })).toEqual(['defaultValues: false → true']);
  });
});
