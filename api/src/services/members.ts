import type { DataSource } from 'typeorm';
import type { Viewer } from '../auth/session-data';
import { Membership, User, type Role } from '../db/entities';
import { AppError, BadRequestError, NotFoundError } from '../errors';
import { audit } from './audit';

export interface MemberView {
  userId: string;
  email: string;
  displayName: string;
  role: Role;
  since: string;
  lastSignInAt: string | null;
}

export async function listMembers(dataSource: DataSource, workspaceId: string): Promise<MemberView[]> {
  const rows = await dataSource.getRepository(Membership).find({ where: { workspaceId }, relations: { user: true }, order: { createdAt: 'ASC' } });
  return rows.map(toMember);
}

/** Adds a person by e-mail (creating the user on first sight); they sign in through the identity provider. */
export async function addMember(dataSource: DataSource, viewer: Viewer, input: { email: string; displayName: string; role: Role }): Promise<MemberView> {
  return dataSource.transaction(async (m) => {
    const email = input.email.trim().toLowerCase();
    let user = await m.getRepository(User).findOneBy({ email });
    user ??= await m.getRepository(User).save({ email, displayName: input.displayName.trim() });
    const existing = await m.getRepository(Membership).findOneBy({ workspaceId: viewer.workspace.id, userId: user.id });
    if (existing) throw new AppError(409, 'conflict', `${email} is already a member (${existing.role}); change their role instead.`);
    const saved = await m.getRepository(Membership).save({ workspaceId: viewer.workspace.id, userId: user.id, role: input.role });
    await audit(m, viewer, 'member.add', { type: 'user', id: user.id }, { email, role: input.role });
    return toMember({ ...saved, user });
  });
}

export async function changeRole(dataSource: DataSource, viewer: Viewer, userId: string, role: Role): Promise<MemberView> {
  return dataSource.transaction(async (m) => {
    const membership = await findMembership(m.getRepository(Membership), viewer.workspace.id, userId);
    if (membership.role === 'owner' && role !== 'owner') await keepAnOwner(m.getRepository(Membership), viewer.workspace.id);
    await m.getRepository(Membership).update(membership.id, { role });
    await audit(m, viewer, 'member.role', { type: 'user', id: userId }, { from: membership.role, to: role });
    return toMember({ ...membership, role });
  });
}

export async function removeMember(dataSource: DataSource, viewer: Viewer, userId: string): Promise<void> {
  await dataSource.transaction(async (m) => {
    const membership = await findMembership(m.getRepository(Membership), viewer.workspace.id, userId);
    if (membership.role === 'owner') await keepAnOwner(m.getRepository(Membership), viewer.workspace.id);
    await m.getRepository(Membership).delete(membership.id);
    await audit(m, viewer, 'member.remove', { type: 'user', id: userId }, { email: membership.user?.email });
  });
}

async function findMembership(repo: import('typeorm').Repository<Membership>, workspaceId: string, userId: string): Promise<Membership> {
  const membership = await repo.findOne({ where: { workspaceId, userId }, relations: { user: true } });
  if (!membership) throw new NotFoundError('No such member in this workspace.');
  return membership;
}

/** A workspace always keeps at least one owner, or nobody could manage it any more. */
async function keepAnOwner(repo: import('typeorm').Repository<Membership>, workspaceId: string): Promise<void> {
  const owners = await repo.countBy({ workspaceId, role: 'owner' });
  if (owners <= 1) throw new BadRequestError('This is the workspace\'s last owner; make someone else owner first.');
}

function toMember(m: Membership): MemberView {
  return {
    userId: m.userId,
    email: m.user!.email,
    displayName: m.user!.displayName,
    role: m.role,
    since: m.createdAt.toISOString(),
    lastSignInAt: m.user!.lastSignInAt?.toISOString() ?? null,
  };
}
