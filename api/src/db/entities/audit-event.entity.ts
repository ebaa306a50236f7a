import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { ApiToken } from './api-token.entity';
import { User } from './user.entity';
import { Workspace } from './workspace.entity';

/** Who did what to which object, for owners to read back. */
@Entity({ name: 'audit_event' })
@Index('ix_audit_event_workspace', ['workspaceId', 'createdAt'])
export class AuditEvent {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_audit_event' })
  id!: string;

  @Column({ name: 'workspace_id', type: 'uuid' })
  workspaceId!: string;

  @ManyToOne(() => Workspace, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'workspace_id', foreignKeyConstraintName: 'FK_audit_event_workspace' })
  workspace?: Workspace;

  @Column({ name: 'actor_user_id', type: 'uuid', nullable: true })
  actorUserId!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'actor_user_id', foreignKeyConstraintName: 'FK_audit_event_actor_user' })
  actorUser?: User | null;

  @Column({ name: 'actor_token_id', type: 'uuid', nullable: true })
  actorTokenId!: string | null;

  @ManyToOne(() => ApiToken, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'actor_token_id', foreignKeyConstraintName: 'FK_audit_event_actor_token' })
  actorToken?: ApiToken | null;

  /** e.g. `snapshot.upload`, `token.create`, `member.role`. */
  @Column({ type: 'varchar', length: 64 })
  action!: string;

  @Column({ name: 'target_type', type: 'varchar', length: 32 })
  targetType!: string;

  @Column({ name: 'target_id', type: 'varchar', length: 120, nullable: true })
  targetId!: string | null;

  @Column({ type: 'jsonb', default: {} })
  details!: Record<string, unknown>;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
