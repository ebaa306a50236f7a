import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Workspaces, people, memberships, codebases, snapshots and the session table. */
export class CreateFoundation1764630000000 implements MigrationInterface {
  name = 'CreateFoundation1764630000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE "workspace" (
      "id" uuid NOT NULL DEFAULT gen_random_uuid(),
      "slug" character varying(64) NOT NULL,
      "name" character varying(200) NOT NULL,
      "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      CONSTRAINT "UQ_workspace_slug" UNIQUE ("slug"),
      CONSTRAINT "PK_workspace" PRIMARY KEY ("id"))`);
    await q.query(`CREATE TABLE "app_user" (
      "id" uuid NOT NULL DEFAULT gen_random_uuid(),
      "email" character varying(320) NOT NULL,
      "display_name" character varying(200) NOT NULL,
      "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      "last_sign_in_at" TIMESTAMP WITH TIME ZONE,
      CONSTRAINT "UQ_app_user_email" UNIQUE ("email"),
      CONSTRAINT "PK_app_user" PRIMARY KEY ("id"))`);
    await q.query(`CREATE TABLE "membership" (
      "id" uuid NOT NULL DEFAULT gen_random_uuid(),
      "workspace_id" uuid NOT NULL,
      "user_id" uuid NOT NULL,
      "role" character varying(16) NOT NULL,
      "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      CONSTRAINT "PK_membership" PRIMARY KEY ("id"),
      CONSTRAINT "CK_membership_role" CHECK ("role" IN ('owner', 'architect', 'reviewer', 'viewer')),
      CONSTRAINT "FK_membership_workspace" FOREIGN KEY ("workspace_id") REFERENCES "workspace"("id") ON DELETE CASCADE,
      CONSTRAINT "FK_membership_user" FOREIGN KEY ("user_id") REFERENCES "app_user"("id") ON DELETE CASCADE)`);
    await q.query(`CREATE UNIQUE INDEX "uq_membership_workspace_user" ON "membership" ("workspace_id", "user_id")`);
    await q.query(`CREATE INDEX "ix_membership_user" ON "membership" ("user_id")`);
    await q.query(`CREATE TABLE "codebase" (
      "id" uuid NOT NULL DEFAULT gen_random_uuid(),
      "workspace_id" uuid NOT NULL,
      "name" character varying(200) NOT NULL,
      "description" text NOT NULL DEFAULT '',
      "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      CONSTRAINT "PK_codebase" PRIMARY KEY ("id"),
      CONSTRAINT "FK_codebase_workspace" FOREIGN KEY ("workspace_id") REFERENCES "workspace"("id") ON DELETE CASCADE)`);
    await q.query(`CREATE UNIQUE INDEX "uq_codebase_workspace_name" ON "codebase" ("workspace_id", "name")`);
    await q.query(`CREATE TABLE "snapshot" (
      "id" uuid NOT NULL DEFAULT gen_random_uuid(),
      "codebase_id" uuid NOT NULL,
      "status" character varying(16) NOT NULL DEFAULT 'queued',
      "progress" smallint NOT NULL DEFAULT 0,
      "error" text,
      "commit_sha" character varying(64),
      "branch" character varying(255),
      "settings" jsonb NOT NULL DEFAULT '{}'::jsonb,
      "totals" jsonb,
      "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      "finished_at" TIMESTAMP WITH TIME ZONE,
      CONSTRAINT "PK_snapshot" PRIMARY KEY ("id"),
      CONSTRAINT "CK_snapshot_status" CHECK ("status" IN ('queued', 'running', 'ready', 'failed')),
      CONSTRAINT "CK_snapshot_progress" CHECK ("progress" BETWEEN 0 AND 100),
      CONSTRAINT "FK_snapshot_codebase" FOREIGN KEY ("codebase_id") REFERENCES "codebase"("id") ON DELETE CASCADE)`);
    await q.query(`CREATE INDEX "ix_snapshot_codebase_created" ON "snapshot" ("codebase_id", "created_at")`);
    // Browser sessions (connect-pg-simple's table layout).
    await q.query(`CREATE TABLE "http_session" (
      "sid" character varying NOT NULL,
      "sess" json NOT NULL,
      "expire" TIMESTAMP(6) NOT NULL,
      CONSTRAINT "PK_http_session" PRIMARY KEY ("sid"))`);
    await q.query(`CREATE INDEX "ix_http_session_expire" ON "http_session" ("expire")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "http_session"`);
    await q.query(`DROP TABLE "snapshot"`);
    await q.query(`DROP TABLE "codebase"`);
    await q.query(`DROP TABLE "membership"`);
    await q.query(`DROP TABLE "app_user"`);
    await q.query(`DROP TABLE "workspace"`);
  }
}
