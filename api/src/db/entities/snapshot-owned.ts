import { JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { Snapshot } from './snapshot.entity';

/**
 * The snapshot id column every per-snapshot table shares: rows of a snapshot are written together
 * in one transaction and go when the snapshot goes. The seven bulk tables (functions, details,
 * modules, module, call and import edges, clusters) have no foreign key: checking it for each of a
 * large snapshot's million rows doubled the time to store it, while the store holds the snapshot
 * row locked anyway. A trigger on snapshot deletes their rows instead (migration
 * SnapshotRowsByTrigger). Smaller tables that point at a snapshot keep a foreign key
 * (snapshotRelation).
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
