import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { ENTITIES } from './entities';
import { MIGRATIONS } from './migrations';

/** Builds (but does not connect) the one DataSource a process uses. Schema changes go through migrations only. */
export function createDataSource(databaseUrl: string): DataSource {
  return new DataSource({
    type: 'postgres',
    url: databaseUrl,
    entities: ENTITIES,
    migrations: MIGRATIONS,
    migrationsTableName: 'typeorm_migrations',
    synchronize: false,
    uuidExtension: 'pgcrypto',
    logging: ['error'],
    extra: { max: 10, application_name: 'seamline' },
  });
}
