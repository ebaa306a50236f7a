import { JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { Snapshot } from './snapshot.entity';

/**
 * The snapshot id column and cascade every per-snapshot table shares: rows of a snapshot are
 * written together in one transaction and go when the snapshot goes.
 */
export function snapshotKey(table: string) {
  return function (target: object, property: string): void {
    PrimaryColumn({ name: 'snapshot_id', type: 'uuid', primaryKeyConstraintName: `PK_${table}` })(target, property);
  };
}

export function snapshotRelation(table: string) {
  return function (target: object, property: string): void {
    ManyToOne(() => Snapshot, { onDelete: 'CASCADE' })(target, property);
    JoinColumn({ name: 'snapshot_id', foreignKeyConstraintName: `FK_${table}_snapshot` })(target, property);
  };
}
