// Starts (or reuses) a scratch PostgreSQL cluster for working on the API by hand, and prints its
// URL for SEAMLINE_TEST_DATABASE_URL. Usage: node scripts/dev-db.mjs [port]   (data in .data/dev)
import * as path from 'node:path';
import { fileURLToPath } from 'node:url';
import { LocalPostgres } from './lib/postgres.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const postgres = new LocalPostgres({ baseDir: path.join(root, '.data/dev'), port: Number(process.argv[2] ?? 54339) });
postgres.start();
postgres.ensureDatabases(['seamline_dev']);
console.log(postgres.url('seamline_dev'));
