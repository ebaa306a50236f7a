import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { CarveAssignment } from './carve-assignment.entity';
import type { Snapshot } from './snapshot.entity';
import { snapshotRelation } from './snapshot-owned';
import { User } from './user.entity';
import { Workspace } from './workspace.entity';

/** A what-if split of one snapshot's modules (at one level) into proposed services. */
@Entity({ name: 'carve_plan' })
@Check('CK_carve_plan_level', `"level" IN ('file', 'folder', 'package')`)
@Index('ix_carve_plan_snapshot', ['snapshotId'])
@Index('ix_carve_plan_workspace', ['workspaceId', 'updatedAt'])
export class CarvePlanRow {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_carve_plan' })
  id!: string;

  @Column({ name: 'workspace_id', type: 'uuid' })
  workspaceId!: string;

  @ManyToOne(() => Workspace, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'workspace_id', foreignKeyConstraintName: 'FK_carve_plan_workspace' })
  workspace?: Workspace;

  @Column({ name: 'snapshot_id', type: 'uuid' })
  snapshotId!: string;

  @snapshotRelation('carve_plan')
  snapshot?: Snapshot;

  @Column({ type: 'varchar', length: 200 })
  name!: string;

  @Column({ type: 'varchar', length: 8 })
  level!: string;

  /** How it started: `clusters` (from Louvain), `empty`, or `copy` of another plan. */
  @Column({ type: 'varchar', length: 16 })
  origin!: string;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdById!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by', foreignKeyConstraintName: 'FK_carve_plan_created_by' })
  createdBy?: User | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt!: Date;

  @OneToMany('CarveAssignment', 'plan')
  assignments?: CarveAssignment[];
}
