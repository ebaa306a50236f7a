import { loadConfig } from '../config';
import { createLogger } from '../logger';
import { createDataSource } from './data-source';
import { seedDemoWorkspace } from './seed-demo';

/** Process entry: applies pending migrations, then seeds the invented demo workspace. */
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger('migrate', config.logLevel);
  const dataSource = await createDataSource(config.databaseUrl).initialize();
  try {
    const applied = await dataSource.runMigrations({ transaction: 'each' });
    logger.info({ applied: applied.map((m) => m.name) }, applied.length ? 'migrations applied' : 'schema up to date');
    if (!process.argv.includes('--no-seed')) {
      const workspace = await seedDemoWorkspace(dataSource);
      logger.info({ workspace: workspace.slug }, 'demo workspace ready');
    }
  } finally {
    await dataSource.destroy();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
