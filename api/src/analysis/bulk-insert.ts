import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { PoolClient } from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { EntityManager } from 'typeorm';

/** A column of a bulk insert and the PostgreSQL type its values are sent as. */
export interface BulkColumn<Row> {
  name: string;
  type: 'uuid' | 'text' | 'integer' | 'boolean' | 'double precision' | 'jsonb';
  value: (row: Row) => unknown;
}

/** Lines handed to the COPY stream at a time: large enough to keep it busy, small enough to stay flat in memory. */
const LINES_PER_CHUNK = 2000;

/**
 * Writes many rows with PostgreSQL's COPY … FROM STDIN (text format) on the caller's transaction
 * connection: one stream per table instead of statements, the fastest way rows go in, and still
 * inside the one transaction that makes the snapshot visible all at once.
 */
export async function bulkInsert<Row>(manager: EntityManager, table: string, columns: BulkColumn<Row>[], rows: readonly Row[]): Promise<void> {
  if (rows.length === 0) return;
  const runner = manager.queryRunner;
  if (!runner?.isTransactionActive) throw new Error(`bulkInsert into ${table} must run inside a transaction`);
  const client = (await runner.connect()) as PoolClient;
  const names = columns.map((c) => `"${c.name}"`).join(', ');
  const copy = client.query(copyFrom(`COPY "${table}" (${names}) FROM STDIN`));
  await pipeline(Readable.from(copyLines(columns, rows)), copy);
}

function* copyLines<Row>(columns: BulkColumn<Row>[], rows: readonly Row[]): Generator<string> {
  let chunk = '';
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i];
    for (let c = 0; c < columns.length; c++) {
      if (c > 0) chunk += '\t';
      chunk += copyField(columns[c].type, columns[c].value(row));
    }
    chunk += '\n';
    if ((i + 1) % LINES_PER_CHUNK === 0) {
      yield chunk;
      chunk = '';
    }
  }
  if (chunk) yield chunk;
}

/** One value in COPY's text format: `\N` for null, backslash escapes for the separators. */
function copyField(type: BulkColumn<unknown>['type'], value: unknown): string {
  if (value === null || value === undefined) return '\\N';
  switch (type) {
    case 'integer':
    case 'double precision':
      return String(value);
    case 'boolean':
      return value ? 't' : 'f';
    case 'jsonb':
      return escapeCopy(JSON.stringify(value));
    default:
      return escapeCopy(String(value));
  }
}

const NEEDS_ESCAPE = /[\\\n\r\t]/;

function escapeCopy(text: string): string {
  if (!NEEDS_ESCAPE.test(text)) return text;
  return text.replace(/[\\\n\r\t]/g, (ch) => (ch === '\\' ? '\\\\' : ch === '\n' ? '\\n' : ch === '\r' ? '\\r' : '\\t'));
}
