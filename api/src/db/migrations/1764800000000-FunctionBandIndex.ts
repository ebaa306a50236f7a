import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The functions table filtered by band and sorted by V(G) (its default order) reads one index range. */
export class FunctionBandIndex1764800000000 implements MigrationInterface {
  name = 'FunctionBandIndex1764800000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE INDEX "ix_function_metric_band" ON "function_metric" ("snapshot_id", "band", "cyclomatic")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "public"."ix_function_metric_band"`);
  }
}
