import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The per-snapshot tables a large snapshot writes up to a million rows into. */
const BULK_TABLES = ['function_metric', 'function_detail', 'module_metric', 'module_edge', 'call_edge', 'import_edge', 'cluster'];

/**
 * The bulk tables lose their foreign key to snapshot, and a trigger deletes their rows when a
 * snapshot goes (directly or with its codebase). PostgreSQL checks a foreign key row by row, so
 * storing a 200,000-function snapshot ran about a million lookups of the same snapshot row and took
 * twice as long as without them; the store holds that row locked for the whole write, so the check
 * could never fail there. (PostgreSQL's "Populating a Database" advises dropping foreign keys for
 * bulk loads; ours cannot be re-added after each load, so the deletion they gave moves to a trigger.)
 */
export class SnapshotRowsByTrigger1764850000000 implements MigrationInterface {
  name = 'SnapshotRowsByTrigger1764850000000';

  async up(q: QueryRunner): Promise<void> {
    for (const table of BULK_TABLES) await q.query(`ALTER TABLE "${table}" DROP CONSTRAINT "FK_${table}_snapshot"`);
    await q.query(`CREATE FUNCTION seamline_delete_snapshot_rows() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        ${BULK_TABLES.map((table) => `DELETE FROM "${table}" WHERE snapshot_id = OLD.id;`).join('\n        ')}
        RETURN OLD;
      END $$`);
    await q.query(`CREATE TRIGGER "tr_snapshot_delete_rows" AFTER DELETE ON "snapshot" FOR EACH ROW EXECUTE FUNCTION seamline_delete_snapshot_rows()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TRIGGER "tr_snapshot_delete_rows" ON "snapshot"`);
    await q.query(`DROP FUNCTION seamline_delete_snapshot_rows()`);
    for (const table of BULK_TABLES) {
      await q.query(`DELETE FROM "${table}" t WHERE NOT EXISTS (SELECT 1 FROM "snapshot" s WHERE s.id = t.snapshot_id)`);
      await q.query(`ALTER TABLE "${table}" ADD CONSTRAINT "FK_${table}_snapshot" FOREIGN KEY ("snapshot_id") REFERENCES "snapshot"("id") ON DELETE CASCADE ON UPDATE NO ACTION`);
    }
  }
}
