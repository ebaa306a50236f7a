import type { ClusterRecord } from '../model';
import { carvePlanFromClusters } from './carvePlanFromClusters';
import { evaluateCarvePlan } from './evaluateCarvePlan';
import { mapSnapshot, moduleRecord } from './fixtures/moduleMapSnapshot';

const cluster = (id: string, members: string[]): ClusterRecord => ({ id, level: 'file', members, functions: 0, cyclomatic: 0, decisions: 0, internalWeight: 0, externalWeight: 0 });

describe('carvePlanFromClusters', () => {
  const modules = [
    moduleRecord('file', 'src/core.ts', { cyclomatic: 40, functions: 5 }),
    moduleRecord('file', 'src/util.ts', { cyclomatic: 12, functions: 9 }),
    moduleRecord('file', 'src/api.ts', { cyclomatic: 12, functions: 3 }),
    moduleRecord('file', 'src/api2.ts', { cyclomatic: 12, functions: 3 }),
    moduleRecord('file', 'src/alone.ts', { cyclomatic: 1, functions: 1 }),
    moduleRecord('folder', 'src', { cyclomatic: 77 }),
  ];

  it("should name each cluster's service after its largest member, ties by functions then path", () => {
    const snapshot = mapSnapshot([], {
      modules,
      clusters: [cluster('c1', ['file:src/util.ts', 'file:src/core.ts']), cluster('c2', ['file:src/api2.ts', 'file:src/api.ts']), { ...cluster('c9', ['folder:src']), level: 'folder' }],
    });
    expect(carvePlanFromClusters(snapshot, 'file')).toEqual({
      level: 'file',
      assignment: { 'file:src/util.ts': 'src/core.ts', 'file:src/core.ts': 'src/core.ts', 'file:src/api2.ts': 'src/api.ts', 'file:src/api.ts': 'src/api.ts' },
    });
  });

  it('should fall back to the cluster id, keep names unique and leave unclustered modules unassigned', () => {
    // c4's largest known member is core.ts again: its service gets the cluster id added.
    const snapshot = mapSnapshot([], {
      modules,
      clusters: [cluster('c1', ['file:src/core.ts']), cluster('c2', ['file:gone.ts']), cluster('c3', ['file:src/util.ts']), cluster('c4', ['file:gone2.ts', 'file:src/core.ts'])],
    });
    const plan = carvePlanFromClusters(snapshot, 'file');
    expect(plan.assignment['file:gone.ts']).toBe('c2');
    expect(plan.assignment['file:src/util.ts']).toBe('src/util.ts');
    expect(plan.assignment['file:gone2.ts']).toBe('src/core.ts (c4)');
    const evaluation = evaluateCarvePlan(snapshot, plan);
    expect(evaluation.unassigned).toEqual(['file:src/api.ts', 'file:src/api2.ts', 'file:src/alone.ts']);
  });
});
