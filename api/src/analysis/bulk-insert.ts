import type { EntityManager } from 'typeorm';

/** A column of a bulk insert and the PostgreSQL type its values are sent as. */
export interface BulkColumn<Row> {
  name: string;
  type: 'uuid' | 'text' | 'integer' | 'boolean' | 'double precision' | 'jsonb';
  value: (row: Row) => unknown;
}

/** Rows per statement: big enough to amortise the round trip, small enough for one message. */
const ROWS_PER_STATEMENT = 5000;

/**
 * Inserts many rows with one `INSERT … SELECT FROM unnest(…)` per chunk: each column travels as
 * one array parameter, so a statement's parameter count stays fixed however many rows it holds.
 * Runs inside the caller's transaction; jsonb values are sent as JSON text.
 */
export async function bulkInsert<Row>(manager: EntityManager, table: string, columns: BulkColumn<Row>[], rows: readonly Row[]): Promise<void> {
  const names = columns.map((c) => `"${c.name}"`).join(', ');
  const arrays = columns.map((c, i) => `$${i + 1}::${c.type === 'jsonb' ? 'text' : c.type}[]`).join(', ');
  const select = columns.map((c, i) => (c.type === 'jsonb' ? `c${i}::jsonb` : `c${i}`)).join(', ');
  const aliases = columns.map((_, i) => `c${i}`).join(', ');
  const sql = `INSERT INTO "${table}" (${names}) SELECT ${select} FROM unnest(${arrays}) AS t(${aliases})`;
  for (let start = 0; start < rows.length; start += ROWS_PER_STATEMENT) {
    const chunk = rows.slice(start, start + ROWS_PER_STATEMENT);
    const params = columns.map((c) =>
      chunk.map((row) => {
        const v = c.value(row);
        if (c.type === 'jsonb') return v === null || v === undefined ? null : JSON.stringify(v);
        return v ?? null;
      }),
    );
    await manager.query(sql, params);
  }
}
