import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The functions table's default order (V(G), ties by id, both in the same direction) read
 * straight from an index, with or without the band filter: the page's ids come from the index
 * alone and only its 50 rows are read from the table, however deep the page.
 */
export class FunctionOrderIndexes1764820000000 implements MigrationInterface {
  name = 'FunctionOrderIndexes1764820000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "public"."ix_function_metric_cyclomatic"`);
    await q.query(`DROP INDEX "public"."ix_function_metric_band"`);
    await q.query(`CREATE INDEX "ix_function_metric_cyclomatic" ON "function_metric" ("snapshot_id", "cyclomatic", "function_id")`);
    await q.query(`CREATE INDEX "ix_function_metric_band" ON "function_metric" ("snapshot_id", "band", "cyclomatic", "function_id")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "public"."ix_function_metric_cyclomatic"`);
    await q.query(`DROP INDEX "public"."ix_function_metric_band"`);
    await q.query(`CREATE INDEX "ix_function_metric_cyclomatic" ON "function_metric" ("snapshot_id", "cyclomatic")`);
    await q.query(`CREATE INDEX "ix_function_metric_band" ON "function_metric" ("snapshot_id", "band", "cyclomatic")`);
  }
}
