import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Snapshot } from './snapshot.entity';
import { snapshotRelation } from './snapshot-owned';
import { User } from './user.entity';

/** A coverage report imported onto a snapshot (the latest one is what the figures show). */
@Entity({ name: 'coverage_import' })
@Index('ix_coverage_import_snapshot', ['snapshotId', 'createdAt'])
export class CoverageImport {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_coverage_import' })
  id!: string;

  @Column({ name: 'snapshot_id', type: 'uuid' })
  snapshotId!: string;

  @snapshotRelation('coverage_import')
  snapshot?: Snapshot;

  @Column({ type: 'varchar', length: 16 })
  format!: string;

  @Column({ name: 'file_name', type: 'varchar', length: 255 })
  fileName!: string;

  @Column({ name: 'uploaded_by', type: 'uuid', nullable: true })
  uploadedById!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'uploaded_by', foreignKeyConstraintName: 'FK_coverage_import_uploaded_by' })
  uploadedBy?: User | null;

  /** Functions the report reached, and outcomes covered of all outcomes. */
  @Column({ name: 'matched_functions', type: 'integer' })
  matchedFunctions!: number;

  @Column({ name: 'outcomes_covered', type: 'integer' })
  outcomesCovered!: number;

  @Column({ name: 'outcomes_total', type: 'integer' })
  outcomesTotal!: number;

  /** Files the report names that the snapshot does not have. */
  @Column({ name: 'unmatched_files', type: 'jsonb' })
  unmatchedFiles!: string[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
