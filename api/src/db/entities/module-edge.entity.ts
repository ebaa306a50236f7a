import { Column, Entity, PrimaryColumn } from 'typeorm';
import { snapshotKey } from './snapshot-owned';

/** Calls and imports between two modules of one level (module ids carry their level). */
@Entity({ name: 'module_edge' })
export class ModuleEdgeRow {
  @snapshotKey('module_edge')
  snapshotId!: string;

  @PrimaryColumn({ name: 'from_module', type: 'text', primaryKeyConstraintName: 'PK_module_edge' })
  fromModule!: string;

  @PrimaryColumn({ name: 'to_module', type: 'text', primaryKeyConstraintName: 'PK_module_edge' })
  toModule!: string;

  @Column({ type: 'varchar', length: 8 })
  level!: string;

  @Column({ type: 'integer' })
  weight!: number;

  @Column({ type: 'integer' })
  calls!: number;

  @Column({ type: 'integer' })
  imports!: number;
}
