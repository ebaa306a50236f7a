import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Codebase } from './codebase.entity';

export const SNAPSHOT_STATUSES = ['queued', 'running', 'ready', 'failed'] as const;
export type SnapshotStatus = (typeof SNAPSHOT_STATUSES)[number];

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
@Index('ix_snapshot_codebase_created', ['codebaseId', 'createdAt'])
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

  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true })
  finishedAt!: Date | null;
}
