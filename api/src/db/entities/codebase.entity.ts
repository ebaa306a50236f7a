import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { Snapshot } from './snapshot.entity';
import { Workspace } from './workspace.entity';

/** One codebase a workspace tracks; its snapshots are analyses over time. */
@Entity({ name: 'codebase' })
@Index('uq_codebase_workspace_name', ['workspaceId', 'name'], { unique: true })
export class Codebase {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_codebase' })
  id!: string;

  @Column({ name: 'workspace_id', type: 'uuid' })
  workspaceId!: string;

  @ManyToOne(() => Workspace, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'workspace_id', foreignKeyConstraintName: 'FK_codebase_workspace' })
  workspace?: Workspace;

  @Column({ type: 'varchar', length: 200 })
  name!: string;

  @Column({ type: 'text', default: '' })
  description!: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;

  @OneToMany('Snapshot', 'codebase')
  snapshots?: Snapshot[];
}
