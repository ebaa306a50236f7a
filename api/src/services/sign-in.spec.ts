import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { Membership, User, type Workspace } from '../db/entities';
import { createTestWorkspace, openTestDataSource } from '../testing/test-database';
import { SignInRefusedError, signInMember } from './sign-in';

describe('signInMember', () => {
  let dataSource: DataSource;
  let workspace: Workspace;
  let other: Workspace;
  beforeAll(async () => {
    dataSource = await openTestDataSource();
    ({ workspace } = await createTestWorkspace(dataSource, []));
    ({ workspace: other } = await createTestWorkspace(dataSource, []));
  });
  afterAll(() => dataSource.destroy());

  const email = () => `Person-${randomUUID().slice(0, 8)}@Test.Example`;

  it('creates the user and membership, then follows the role and name the IdP sends', async () => {
    const address = email();
    const first = await signInMember(dataSource, { email: address, displayName: 'Ada', role: 'viewer' }, workspace.slug);
    expect(first).toMatchObject({ workspaceId: workspace.id, role: 'viewer' });
    const user = await dataSource.getRepository(User).findOneByOrFail({ id: first.userId });
    expect(user.email).toBe(address.toLowerCase());
    expect(user.lastSignInAt).toBeInstanceOf(Date);

    const second = await signInMember(dataSource, { email: address, displayName: 'Ada L.', role: 'architect', workspaceSlug: workspace.slug }, other.slug);
    expect(second.userId).toBe(first.userId);
    expect(await dataSource.getRepository(User).findOneByOrFail({ id: first.userId })).toMatchObject({ displayName: 'Ada L.' });
    const memberships = await dataSource.getRepository(Membership).findBy({ userId: first.userId });
    expect(memberships.map((m) => [m.workspaceId, m.role])).toEqual([[workspace.id, 'architect']]);
  });

  it('falls back to the default workspace and to the e-mail for the name', async () => {
    const result = await signInMember(dataSource, { email: email(), role: 'reviewer' }, other.slug);
    expect(result.workspaceId).toBe(other.id);
    const user = await dataSource.getRepository(User).findOneByOrFail({ id: result.userId });
    expect(user.displayName).toMatch(/^person-/);
  });

  it.each([
    ['an unknown role', { role: 'wizard' }, /role “wizard”/],
    ['an unknown workspace', { role: 'viewer', workspaceSlug: 'no-such-workspace' }, /workspace “no-such-workspace”/],
    ['a NameID that is not an e-mail', { role: 'viewer', email: 'not-an-email' }, /e-mail/],
  ])('refuses %s and writes nothing', async (_name, claims, message) => {
    const address = email();
    const attempt = signInMember(dataSource, { email: address, ...claims }, workspace.slug);
    await expect(attempt).rejects.toThrow(SignInRefusedError);
    await expect(attempt).rejects.toThrow(message);
    expect(await dataSource.getRepository(User).findOneBy({ email: address.toLowerCase() })).toBeNull();
  });
});
