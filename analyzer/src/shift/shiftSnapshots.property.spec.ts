import fc from 'fast-check';
import type { FunctionRecord } from '../model';
import { syntheticFunction, syntheticSnapshot } from '../snapshot/fixtures/syntheticSnapshot';
import type { FunctionShiftStatus } from './Shift';
import { shiftSnapshots } from './shiftSnapshots';

const FILES = ['src/a/one.ts', 'src/a/two.ts', 'src/b/three.ts', 'top.ts'];
type Edit = 'keep' | 'change' | 'remove' | 'move' | 'rename';
const EXPECTED: Record<Edit, FunctionShiftStatus | undefined> = { keep: 'same', change: 'changed', remove: undefined, move: 'moved', rename: 'renamed' };

const fnAt = (file: number, name: string, cyclomatic: number, fingerprint: string): FunctionRecord =>
  syntheticFunction({ file: FILES[file], qualifiedName: name, cyclomatic, fingerprint, line: 1 });

// A synthetic codebase (unique names and bodies), one edit per function, and some added functions.
const editedPair = fc
  .record({
    functions: fc.array(fc.record({ file: fc.nat({ max: FILES.length - 1 }), v: fc.integer({ min: 1, max: 14 }), edit: fc.constantFrom<Edit>('keep', 'change', 'remove', 'move', 'rename'), newV: fc.integer({ min: 1, max: 14 }), hop: fc.integer({ min: 1, max: FILES.length - 1 }) }), { maxLength: 24 }),
    added: fc.array(fc.record({ file: fc.nat({ max: FILES.length - 1 }), v: fc.integer({ min: 1, max: 14 }) }), { maxLength: 6 }),
    limit: fc.integer({ min: 1, max: 12 }),
  })
  .map(({ functions, added, limit }) => {
    const before: FunctionRecord[] = [];
    const after: FunctionRecord[] = [];
    functions.forEach(({ file, v, edit, newV, hop }, i) => {
      before.push(fnAt(file, `f${i}`, v, `body${i}`));
      if (edit === 'keep') after.push(fnAt(file, `f${i}`, v, `body${i}`));
      if (edit === 'change') after.push(fnAt(file, `f${i}`, newV, `body${i}-edited`));
      if (edit === 'move') after.push(fnAt((file + hop) % FILES.length, `f${i}`, v, `body${i}`));
      if (edit === 'rename') after.push(fnAt(file, `renamed${i}`, v, `body${i}`));
    });
    added.forEach(({ file, v }, i) => after.push(fnAt(file, `new${i}`, v, `new-body${i}`)));
    return { edits: functions.map((f) => f.edit), before: syntheticSnapshot(before, { limit }), after: syntheticSnapshot(after, { limit }), added: added.length };
  });

describe('shiftSnapshots properties', () => {
  it('should find every edit: same, changed, moved, renamed, removed and added', () => {
    fc.assert(
      fc.property(editedPair, ({ edits, before, after, added }) => {
        const shift = shiftSnapshots(before, after);
        edits.forEach((edit, i) => {
          const row = shift.functions.find((f) => f.before?.qualifiedName === `f${i}`)!;
          expect(row.status).toBe(EXPECTED[edit] ?? 'removed');
        });
        expect(shift.counts.added).toBe(added);
      }),
      { numRuns: 500 },
    );
  });

  it('should always give ΔΣV(strict) = Δ Σ decisions + ΔP, and sums that agree with the snapshots', () => {
    fc.assert(
      fc.property(editedPair, ({ before, after }) => {
        const { totals, functions, modules, crossed } = shiftSnapshots(before, after);
        // ΣV = Σ decisions + P (McCabe 1976: v = e − n + 2p, one component per function).
        expect(totals.deltaCyclomaticStrict).toBe(totals.deltaDecisions + totals.deltaFunctions);
        expect(totals.unexplained).toBe(0);
        expect(totals.deltaCyclomatic).toBe(after.totals.cyclomatic - before.totals.cyclomatic);
        expect(totals.deltaFunctions).toBe(after.totals.functions - before.totals.functions);
        expect(totals.decisionsFrom.kept + totals.decisionsFrom.added + totals.decisionsFrom.removed).toBe(totals.deltaDecisions);
        expect(functions.reduce((s, f) => s + f.deltaCyclomatic, 0)).toBe(totals.deltaCyclomatic);
        for (const level of ['file', 'folder']) {
          const own = modules.filter((m) => m.level === level);
          expect(own.reduce((s, m) => s + m.deltaCyclomatic, 0)).toBe(totals.deltaCyclomatic);
          expect(own.reduce((s, m) => s + m.deltaFunctions, 0)).toBe(totals.deltaFunctions);
          for (const m of own) expect(m.after.cyclomaticStrict - m.before.cyclomaticStrict).toBe(m.deltaDecisions + m.deltaFunctions);
        }
        // Crossings up minus crossings down = the change in functions over the limit.
        const ups = crossed.functions.filter((f) => f.crossed === 'up').length;
        const downs = crossed.functions.filter((f) => f.crossed === 'down').length;
        expect(ups - downs).toBe(after.totals.overLimit - before.totals.overLimit);
      }),
      { numRuns: 500 },
    );
  });
});
