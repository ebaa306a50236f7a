import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A function's graph and covered outcomes are read whole and never queried inside, so they are
 * stored as `json` (validated text) rather than `jsonb`: storing a large snapshot spends less
 * time converting them.
 */
export class FunctionDetailJson1764810000000 implements MigrationInterface {
  name = 'FunctionDetailJson1764810000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "function_detail" ALTER COLUMN "graph" TYPE json USING "graph"::json`);
    await q.query(`ALTER TABLE "function_detail" ALTER COLUMN "coverage_outcomes" TYPE json USING "coverage_outcomes"::json`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "function_detail" ALTER COLUMN "coverage_outcomes" TYPE jsonb USING "coverage_outcomes"::jsonb`);
    await q.query(`ALTER TABLE "function_detail" ALTER COLUMN "graph" TYPE jsonb USING "graph"::jsonb`);
  }
}
