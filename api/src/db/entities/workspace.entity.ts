import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, Unique } from 'typeorm';

/** A team's space: its codebases, members and settings. */
@Entity({ name: 'workspace' })
@Unique('UQ_workspace_slug', ['slug'])
export class Workspace {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_workspace' })
  id!: string;

  /** Short stable handle, unique across the installation (e.g. `otterbay`). */
  @Column({ type: 'varchar', length: 64 })
  slug!: string;

  @Column({ type: 'varchar', length: 200 })
  name!: string;

  /** The limit and counting settings analyses use unless told otherwise (see workspace-settings.ts). */
  @Column({ type: 'jsonb', default: {} })
  settings!: Record<string, unknown>;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
