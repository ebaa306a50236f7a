import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from './user.entity';
import { Workspace } from './workspace.entity';

/** The four roles, from most to least powerful. */
export const ROLES = ['owner', 'architect', 'reviewer', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

/** A person's role in one workspace. */
@Entity({ name: 'membership' })
@Check('CK_membership_role', `"role" IN ('owner', 'architect', 'reviewer', 'viewer')`)
@Index('uq_membership_workspace_user', ['workspaceId', 'userId'], { unique: true })
export class Membership {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_membership' })
  id!: string;

  @Column({ name: 'workspace_id', type: 'uuid' })
  workspaceId!: string;

  @ManyToOne(() => Workspace, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'workspace_id', foreignKeyConstraintName: 'FK_membership_workspace' })
  workspace?: Workspace;

  @Index('ix_membership_user')
  @Column({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'FK_membership_user' })
  user?: User;

  @Column({ type: 'varchar', length: 16 })
  role!: Role;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
