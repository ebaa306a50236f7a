import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Codebase } from './codebase.entity';
import { User } from './user.entity';

export const SNAPSHOT_STATUSES = ['queued', 'running', 'ready', 'failed'] as const;
export type SnapshotStatus = (typeof SNAPSHOT_STATUSES)[number];

/** How the code came in: a zip analysed by a worker, or a snapshot `seamline push`ed from CI. */
export const SNAPSHOT_SOURCES = ['upload', 'push'] as const;
export type SnapshotSource = (typeof SNAPSHOT_SOURCES)[number];

/** Headline figures of a finished analysis (filled by the analyzer's result). */
export interface SnapshotTotals {
  functions: number;
  cyclomatic: number;
  decisions: number;
  [figure: string]: number;
}

/** One analysis of a codebase at a point in time. */
@Entity({ name: 'snapshot' })
@Check('CK_snapshot_status', `"status" IN ('queued', 'running', 'ready', 'failed')`)
@Check('CK_snapshot_progress', `"progress" BETWEEN 0 AND 100`)
@Check('CK_snapshot_source', `"source" IN ('upload', 'push')`)
@Index('ix_snapshot_codebase_created', ['codebaseId', 'createdAt'])
@Index('ix_snapshot_status_heartbeat', ['status', 'heartbeatAt'])
export class Snapshot {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_snapshot' })
  id!: string;

  @Column({ name: 'codebase_id', type: 'uuid' })
  codebaseId!: string;

  @ManyToOne(() => Codebase, (c) => c.snapshots, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'codebase_id', foreignKeyConstraintName: 'FK_snapshot_codebase' })
  codebase?: Codebase;

  @Column({ type: 'varchar', length: 16, default: 'queued' })
  status!: SnapshotStatus;

  /** Percent done while running, 0–100. */
  @Column({ type: 'smallint', default: 0 })
  progress!: number;

  /** What the analysis is doing now (`extract`, `discover`, `analyse`, `calls`, `store`…). */
  @Column({ type: 'varchar', length: 16, nullable: true })
  phase!: string | null;

  @Column({ type: 'varchar', length: 8, default: 'upload' })
  source!: SnapshotSource;

  /** The uploaded zip or pushed file while the job waits for it; removed once stored or failed. */
  @Column({ name: 'input_file', type: 'text', nullable: true })
  inputFile!: string | null;

  /** The queue job analysing it, and when its worker last said it was alive. */
  @Column({ name: 'job_id', type: 'uuid', nullable: true })
  jobId!: string | null;

  @Column({ name: 'heartbeat_at', type: 'timestamptz', nullable: true })
  heartbeatAt!: Date | null;

  /** How many times a worker started on it (a retried job counts again). */
  @Column({ type: 'smallint', default: 0 })
  attempts!: number;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdById!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by', foreignKeyConstraintName: 'FK_snapshot_created_by' })
  createdBy?: User | null;

  /** The scanned folder's name, the analyzer version, files scanned and skipped (with reasons). */
  @Column({ type: 'varchar', length: 255, nullable: true })
  root!: string | null;

  @Column({ name: 'generator_version', type: 'varchar', length: 32, nullable: true })
  generatorVersion!: string | null;

  @Column({ name: 'files_scanned', type: 'integer', nullable: true })
  filesScanned!: number | null;

  @Column({ type: 'jsonb', nullable: true })
  skipped!: unknown[] | null;

  @Column({ name: 'map_settings', type: 'jsonb', nullable: true })
  mapSettings!: Record<string, unknown> | null;

  /** Calls into external packages, summed per package. */
  @Column({ type: 'jsonb', nullable: true })
  externals!: unknown[] | null;

  /** The latest coverage import: its format and the report's files the scan did not have. */
  @Column({ type: 'jsonb', nullable: true })
  coverage!: Record<string, unknown> | null;

  /** Why the analysis failed, in words a person can act on. */
  @Column({ type: 'text', nullable: true })
  error!: string | null;

  @Column({ name: 'commit_sha', type: 'varchar', length: 64, nullable: true })
  commit!: string | null;

  @Column({ type: 'varchar', length: 255, nullable: true })
  branch!: string | null;

  /** The counting settings and limit the analysis used. */
  @Column({ type: 'jsonb', default: {} })
  settings!: Record<string, unknown>;

  @Column({ type: 'jsonb', nullable: true })
  totals!: SnapshotTotals | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;

  @Column({ name: 'started_at', type: 'timestamptz', nullable: true })
  startedAt!: Date | null;

  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true })
  finishedAt!: Date | null;
}
