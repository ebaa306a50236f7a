import { fn, mapSnapshot, moduleRecord, ORDERS_AND_BILLING_FILES as F, ordersAndBilling } from '../carve/fixtures/moduleMapSnapshot';
import { IncomparableShiftError } from './IncomparableShiftError';
import { shiftPlan } from './shiftPlan';

const plan = {
  level: 'file' as const,
  assignment: { [`file:${F.A}`]: 'orders', [`file:${F.B}`]: 'orders', [`file:${F.C}`]: 'billing', [`file:${F.D}`]: 'billing', [`file:${F.E}`]: 'billing' },
};

describe('shiftPlan', () => {
  it('should compare a plan’s services and split figures across two snapshots', () => {
    const before = ordersAndBilling();
    // After: e.ts's function and its calls are gone (its module too), and a.ts gains a function with V 4.
    const after = mapSnapshot([...before.functions.filter((f) => f.file !== F.E), fn(F.A, 'a3', 4)], {
      modules: before.modules!.filter((m) => m.path !== F.E),
      moduleEdges: before.moduleEdges!.filter((e) => e.from !== `file:${F.E}`),
      calls: before.calls!.filter((c) => !c.from.startsWith(F.E)),
    });
    const shift = shiftPlan(before, after, plan);
    expect(shift.services.map((s) => [s.service, s.deltaFunctions, s.deltaCyclomatic, s.deltaDecisions, s.deltaLines])).toEqual([
      ['billing', -1, -2, -1, -10],
      ['orders', 1, 4, 3, 0],
    ]);
    // Cut before: weight 6, 4 entries, 4 sites (carve.md); after: b→c 2 and d→a 1 only, one site each.
    expect(shift.delta).toMatchObject({ cutWeight: -3, cutEdges: -2, cutCalls: -2 });
    expect(shift.delta.modularity).toBeCloseTo(shift.after.modularity - shift.before.modularity, 12);
  });

  it('should show a service present on one side only with null on the other', () => {
    const before = ordersAndBilling();
    const after = mapSnapshot([...before.functions, fn('src/new.ts', 'n1', 3)], {
      modules: [...before.modules!, moduleRecord('file', 'src/new.ts')],
      moduleEdges: before.moduleEdges,
      calls: before.calls,
    });
    const shift = shiftPlan(before, after, { ...plan, assignment: { ...plan.assignment, 'file:src/new.ts': 'new' } });
    expect(shift.services.find((s) => s.service === 'new')).toMatchObject({ before: null, after: { functions: 1, cyclomatic: 3 }, deltaFunctions: 1, deltaCyclomatic: 3 });
    expect(shift.services.filter((s) => s.service !== 'new').every((s) => s.deltaCyclomatic === 0)).toBe(true);
  });

  it('should refuse snapshots counted under different settings', () => {
    const before = ordersAndBilling();
    const after = { ...before, settings: { ...before.settings, defaultValues: true } };
    expect(() => shiftPlan(before, after, plan)).toThrow(IncomparableShiftError);
  });
});
