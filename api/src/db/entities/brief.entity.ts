import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { CarvePlanRow } from './carve-plan.entity';
import { Snapshot } from './snapshot.entity';
import { User } from './user.entity';
import { Workspace } from './workspace.entity';

export const BRIEF_STATUSES = ['draft', 'in_review', 'decided'] as const;

/** One section of a brief: a heading, text and the evidence it cites. */
export interface BriefSection {
  heading: string;
  body: string;
  evidence?: { kind: string; ref: string }[];
}

/** The evidence for a change, written up for the architecture board. */
@Entity({ name: 'brief' })
@Check('CK_brief_status', `"status" IN ('draft', 'in_review', 'decided')`)
@Index('ix_brief_workspace', ['workspaceId', 'updatedAt'])
export class Brief {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_brief' })
  id!: string;

  @Column({ name: 'workspace_id', type: 'uuid' })
  workspaceId!: string;

  @ManyToOne(() => Workspace, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'workspace_id', foreignKeyConstraintName: 'FK_brief_workspace' })
  workspace?: Workspace;

  @Column({ name: 'snapshot_id', type: 'uuid', nullable: true })
  snapshotId!: string | null;

  @ManyToOne(() => Snapshot, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'snapshot_id', foreignKeyConstraintName: 'FK_brief_snapshot' })
  snapshot?: Snapshot | null;

  @Column({ name: 'carve_plan_id', type: 'uuid', nullable: true })
  carvePlanId!: string | null;

  @ManyToOne(() => CarvePlanRow, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'carve_plan_id', foreignKeyConstraintName: 'FK_brief_carve_plan' })
  carvePlan?: CarvePlanRow | null;

  @Column({ type: 'varchar', length: 200 })
  title!: string;

  @Column({ type: 'varchar', length: 16, default: 'draft' })
  status!: (typeof BRIEF_STATUSES)[number];

  @Column({ type: 'jsonb', default: [] })
  sections!: BriefSection[];

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdById!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by', foreignKeyConstraintName: 'FK_brief_created_by' })
  createdBy?: User | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt!: Date;
}
