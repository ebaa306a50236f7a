import { Column, Entity, PrimaryColumn } from 'typeorm';
import { snapshotKey } from './snapshot-owned';

/** A candidate boundary: modules Louvain grouped together at one level. */
@Entity({ name: 'cluster' })
export class ClusterRow {
  @snapshotKey('cluster')
  snapshotId!: string;

  /** Cluster ids (`c1`, `c2`…) are numbered per level. */
  @PrimaryColumn({ type: 'varchar', length: 8, primaryKeyConstraintName: 'PK_cluster' })
  level!: string;

  @PrimaryColumn({ name: 'cluster_id', type: 'varchar', length: 64, primaryKeyConstraintName: 'PK_cluster' })
  clusterId!: string;

  /** Module ids. */
  @Column({ type: 'jsonb' })
  members!: string[];

  @Column({ type: 'integer' })
  functions!: number;

  @Column({ type: 'integer' })
  cyclomatic!: number;

  @Column({ type: 'integer' })
  decisions!: number;

  @Column({ name: 'internal_weight', type: 'integer' })
  internalWeight!: number;

  @Column({ name: 'external_weight', type: 'integer' })
  externalWeight!: number;
}
