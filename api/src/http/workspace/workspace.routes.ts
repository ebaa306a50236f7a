import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { ROLES, Workspace } from '../../db/entities';
import { audit } from '../../services/audit';
import { addMember, changeRole, listMembers, removeMember } from '../../services/members';
import { effectiveSettings, workspaceSettingsPatch } from '../../services/workspace-settings';
import { allow } from '../policy';
import { validate } from '../validate';
import { memberOf } from '../viewer';

const userParams = z.object({ userId: z.uuid('must be a user id') });
const newMember = z.object({ email: z.email(), displayName: z.string().trim().min(1).max(200), role: z.enum(ROLES) }).strict();
const roleChange = z.object({ role: z.enum(ROLES) }).strict();

/** /api/workspace — the workspace, its settings (owners edit) and its members (owners manage). */
export function workspaceRoutes(dataSource: DataSource): Router {
  const router = Router();
  router.get('/', allow('workspace.read'), async (req, res) => {
    const { workspace } = memberOf(req);
    const fresh = await dataSource.getRepository(Workspace).findOneByOrFail({ id: workspace.id });
    res.json({ workspace: { id: fresh.id, slug: fresh.slug, name: fresh.name, settings: effectiveSettings(fresh.settings) } });
  });
  router.patch('/settings', allow('workspace.settings'), async (req, res) => {
    const viewer = memberOf(req);
    const patch = validate(workspaceSettingsPatch, req.body, 'body');
    const settings = await dataSource.transaction(async (m) => {
      const ws = await m.getRepository(Workspace).findOneByOrFail({ id: viewer.workspace.id });
      const next = { ...effectiveSettings(ws.settings), ...patch };
      await m.getRepository(Workspace).update(ws.id, { settings: { ...next } });
      await audit(m, viewer, 'workspace.settings', { type: 'workspace', id: ws.id }, { ...patch });
      return next;
    });
    res.json({ settings });
  });
  router.get('/members', allow('members.read'), async (req, res) => {
    res.json({ items: await listMembers(dataSource, memberOf(req).workspace.id) });
  });
  router.post('/members', allow('members.manage'), async (req, res) => {
    res.status(201).json({ member: await addMember(dataSource, memberOf(req), validate(newMember, req.body, 'body')) });
  });
  router.patch('/members/:userId', allow('members.manage'), async (req, res) => {
    const { userId } = validate(userParams, req.params, 'params');
    res.json({ member: await changeRole(dataSource, memberOf(req), userId, validate(roleChange, req.body, 'body').role) });
  });
  router.delete('/members/:userId', allow('members.manage'), async (req, res) => {
    await removeMember(dataSource, memberOf(req), validate(userParams, req.params, 'params').userId);
    res.status(204).end();
  });
  return router;
}
