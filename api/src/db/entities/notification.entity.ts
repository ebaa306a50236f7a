import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Workspace } from './workspace.entity';

/** The mail log: every message Seamline sent or tried to send. */
@Entity({ name: 'notification' })
@Check('CK_notification_status', `"status" IN ('queued', 'sent', 'failed')`)
@Index('ix_notification_workspace', ['workspaceId', 'createdAt'])
export class Notification {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_notification' })
  id!: string;

  @Column({ name: 'workspace_id', type: 'uuid' })
  workspaceId!: string;

  @ManyToOne(() => Workspace, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'workspace_id', foreignKeyConstraintName: 'FK_notification_workspace' })
  workspace?: Workspace;

  @Column({ type: 'varchar', length: 320 })
  recipient!: string;

  @Column({ type: 'varchar', length: 40 })
  kind!: string;

  @Column({ type: 'varchar', length: 300 })
  subject!: string;

  @Column({ type: 'varchar', length: 8, default: 'queued' })
  status!: 'queued' | 'sent' | 'failed';

  @Column({ type: 'text', nullable: true })
  error!: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;

  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true })
  sentAt!: Date | null;
}
