import type { DataSource } from 'typeorm';
import { DEMO_PEOPLE, DEMO_WORKSPACE } from '../demo/demo-people';
import { Membership, User, Workspace } from './entities';

/**
 * Seeds the invented demo workspace and its four members. Idempotent: existing rows are kept,
 * so data entered through the app survives a restart. Codebases are not invented here.
 */
export async function seedDemoWorkspace(dataSource: DataSource): Promise<Workspace> {
  return dataSource.transaction(async (em) => {
    await em.createQueryBuilder().insert().into(Workspace).values(DEMO_WORKSPACE).orIgnore().execute();
    const workspace = await em.findOneByOrFail(Workspace, { slug: DEMO_WORKSPACE.slug });
    for (const person of DEMO_PEOPLE) {
      await em.createQueryBuilder().insert().into(User)
        .values({ email: person.email, displayName: person.displayName }).orIgnore().execute();
      const user = await em.findOneByOrFail(User, { email: person.email });
      await em.createQueryBuilder().insert().into(Membership)
        .values({ workspaceId: workspace.id, userId: user.id, role: person.role }).orIgnore().execute();
    }
    return workspace;
  });
}
