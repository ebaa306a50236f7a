import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { carvePlanFromClusters, evaluateCarve, type CarvePlan, type ModuleLevel } from '../analyzer-lib';
import type { Viewer } from '../auth/session-data';
import { CarveAssignment, CarvePlanRow } from '../db/entities';
import { BadRequestError, NotFoundError } from '../errors';
import { audit } from './audit';
import type { SnapshotCache } from './snapshot-cache';
import { requireModuleMap, readySnapshot } from './snapshot-access';
import { levelSchema } from './module-queries';

const serviceName = z.string().trim().min(1, 'must not be empty').max(120);

export const createPlanSchema = z.object({
  snapshotId: z.uuid(),
  name: z.string().trim().min(1).max(200),
  level: levelSchema.default('folder'),
  from: z.enum(['clusters', 'empty']).default('clusters'),
}).strict();

/** Assignments to change: module id → service name, or null to leave the module unassigned. */
export const updatePlanSchema = z.object({
  name: z.string().trim().min(1).max(200).optional(),
  assignments: z.record(z.string().min(1).max(1000), serviceName.nullable()).optional(),
}).strict();

export const duplicatePlanSchema = z.object({ name: z.string().trim().min(1).max(200).optional() }).strict();

/** Carve plans: created from the Louvain clusters or empty, edited, evaluated by the analyzer, duplicated. */
export class CarvePlanService {
  constructor(private readonly dataSource: DataSource, private readonly cache: SnapshotCache) {}

  async list(workspaceId: string, snapshotId?: string) {
    const plans = await this.dataSource.getRepository(CarvePlanRow).find({
      where: { workspaceId, ...(snapshotId ? { snapshotId } : {}) }, relations: { createdBy: true }, order: { updatedAt: 'DESC' },
    });
    return plans.map((p) => this.summary(p));
  }

  async create(viewer: Viewer, input: z.infer<typeof createPlanSchema>) {
    const snapshot = await readySnapshot(this.dataSource, viewer.workspace.id, input.snapshotId);
    requireModuleMap(snapshot);
    const assignment = input.from === 'clusters' ? carvePlanFromClusters(await this.cache.snapshot(snapshot.id), input.level).assignment : {};
    const id = await this.dataSource.transaction(async (m) => {
      const plan = await m.getRepository(CarvePlanRow).save({
        workspaceId: viewer.workspace.id, snapshotId: snapshot.id, name: input.name, level: input.level, origin: input.from, createdById: viewer.user?.id ?? null,
      });
      await m.getRepository(CarveAssignment).insert(Object.entries(assignment).map(([moduleId, service]) => ({ planId: plan.id, moduleId, service })));
      await audit(m, viewer, 'plan.create', { type: 'carve_plan', id: plan.id }, { name: plan.name, from: input.from, level: input.level });
      return plan.id;
    });
    return this.get(viewer.workspace.id, id);
  }

  /** The plan, its assignments and the analyzer's evaluation of it. */
  async get(workspaceId: string, id: string) {
    const plan = await this.find(workspaceId, id);
    const assignment = await this.assignmentOf(id);
    const carve: CarvePlan = { level: plan.level as ModuleLevel, assignment };
    const evaluation = evaluateCarve(await this.cache.carveIndex(plan.snapshotId, carve.level), carve);
    return { plan: this.summary(plan), assignment, evaluation };
  }

  async update(viewer: Viewer, id: string, input: z.infer<typeof updatePlanSchema>) {
    const plan = await this.find(viewer.workspace.id, id);
    if (input.assignments) {
      const snapshot = await this.cache.snapshot(plan.snapshotId);
      const known = new Set((snapshot.modules ?? []).filter((m) => m.level === plan.level).map((m) => m.id));
      const unknown = Object.keys(input.assignments).filter((m) => !known.has(m));
      if (unknown.length > 0) {
        throw new BadRequestError(`These are not ${plan.level} modules of the plan's snapshot: ${unknown.slice(0, 5).join(', ')}${unknown.length > 5 ? ` and ${unknown.length - 5} more` : ''}.`, { unknown });
      }
    }
    await this.dataSource.transaction(async (m) => {
      if (input.name) await m.getRepository(CarvePlanRow).update(id, { name: input.name });
      const entries = Object.entries(input.assignments ?? {});
      const cleared = entries.filter(([, service]) => service === null).map(([moduleId]) => moduleId);
      const set = entries.filter(([, service]) => service !== null).map(([moduleId, service]) => ({ planId: id, moduleId, service: service! }));
      if (cleared.length) await m.createQueryBuilder().delete().from(CarveAssignment).where('plan_id = :id AND module_id IN (:...cleared)', { id, cleared }).execute();
      if (set.length) await m.getRepository(CarveAssignment).upsert(set, ['planId', 'moduleId']);
      if (!input.name) await m.getRepository(CarvePlanRow).update(id, { updatedAt: new Date() });
      await audit(m, viewer, 'plan.update', { type: 'carve_plan', id }, { name: input.name, changed: entries.length });
    });
    return this.get(viewer.workspace.id, id);
  }

  async duplicate(viewer: Viewer, id: string, name?: string) {
    const plan = await this.find(viewer.workspace.id, id);
    const assignment = await this.assignmentOf(id);
    const copyId = await this.dataSource.transaction(async (m) => {
      const copy = await m.getRepository(CarvePlanRow).save({
        workspaceId: plan.workspaceId, snapshotId: plan.snapshotId, name: name ?? `${plan.name} (copy)`, level: plan.level, origin: 'copy', createdById: viewer.user?.id ?? null,
      });
      await m.getRepository(CarveAssignment).insert(Object.entries(assignment).map(([moduleId, service]) => ({ planId: copy.id, moduleId, service })));
      await audit(m, viewer, 'plan.duplicate', { type: 'carve_plan', id: copy.id }, { from: id });
      return copy.id;
    });
    return this.get(viewer.workspace.id, copyId);
  }

  async remove(viewer: Viewer, id: string): Promise<void> {
    const plan = await this.find(viewer.workspace.id, id);
    await this.dataSource.transaction(async (m) => {
      await m.getRepository(CarvePlanRow).delete(id);
      await audit(m, viewer, 'plan.delete', { type: 'carve_plan', id }, { name: plan.name });
    });
  }

  /** A plan as a CarvePlan the analyzer reads (for shift of a plan, exports). */
  async asCarvePlan(workspaceId: string, id: string): Promise<{ row: CarvePlanRow; plan: CarvePlan }> {
    const row = await this.find(workspaceId, id);
    return { row, plan: { level: row.level as ModuleLevel, assignment: await this.assignmentOf(id) } };
  }

  private async find(workspaceId: string, id: string): Promise<CarvePlanRow> {
    const plan = await this.dataSource.getRepository(CarvePlanRow).findOne({ where: { id, workspaceId }, relations: { createdBy: true } });
    if (!plan) throw new NotFoundError('No such carve plan in this workspace.');
    return plan;
  }

  private async assignmentOf(planId: string): Promise<Record<string, string>> {
    const rows = await this.dataSource.getRepository(CarveAssignment).find({ where: { planId }, order: { moduleId: 'ASC' } });
    return Object.fromEntries(rows.map((r) => [r.moduleId, r.service]));
  }

  private summary(p: CarvePlanRow) {
    return {
      id: p.id, name: p.name, snapshotId: p.snapshotId, level: p.level, origin: p.origin,
      createdBy: p.createdBy?.displayName ?? null, createdAt: p.createdAt.toISOString(), updatedAt: p.updatedAt.toISOString(),
    };
  }
}
