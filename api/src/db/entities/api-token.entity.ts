import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from './user.entity';
import { Workspace } from './workspace.entity';

/** A workspace token for CI pushes. Only a SHA-256 of the secret is kept; it is shown once. */
@Entity({ name: 'api_token' })
@Index('uq_api_token_hash', ['tokenHash'], { unique: true })
@Index('ix_api_token_workspace', ['workspaceId'])
export class ApiToken {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_api_token' })
  id!: string;

  @Column({ name: 'workspace_id', type: 'uuid' })
  workspaceId!: string;

  @ManyToOne(() => Workspace, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'workspace_id', foreignKeyConstraintName: 'FK_api_token_workspace' })
  workspace?: Workspace;

  @Column({ type: 'varchar', length: 100 })
  name!: string;

  @Column({ name: 'token_hash', type: 'varchar', length: 64 })
  tokenHash!: string;

  /** The first characters of the secret, so people can tell their tokens apart. */
  @Column({ type: 'varchar', length: 16 })
  prefix!: string;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdById!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by', foreignKeyConstraintName: 'FK_api_token_created_by' })
  createdBy?: User | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;

  @Column({ name: 'last_used_at', type: 'timestamptz', nullable: true })
  lastUsedAt!: Date | null;

  @Column({ name: 'revoked_at', type: 'timestamptz', nullable: true })
  revokedAt!: Date | null;
}
