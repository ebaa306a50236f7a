import { Column, Entity, Index, PrimaryColumn } from 'typeorm';
import { snapshotKey } from './snapshot-owned';

/** Calls from one function to another, merged per kind and certainty (the analyzer's CallEdge). */
@Entity({ name: 'call_edge' })
@Index('ix_call_edge_from', ['snapshotId', 'fromFunction'])
@Index('ix_call_edge_to', ['snapshotId', 'toFunction'])
export class CallEdgeRow {
  @snapshotKey('call_edge')
  snapshotId!: string;

  /** Position in the snapshot's list. */
  @PrimaryColumn({ type: 'integer', primaryKeyConstraintName: 'PK_call_edge' })
  ordinal!: number;

  @Column({ name: 'from_function', type: 'text' })
  fromFunction!: string;

  @Column({ name: 'to_function', type: 'text' })
  toFunction!: string;

  @Column({ type: 'integer' })
  count!: number;

  @Column({ type: 'varchar', length: 16 })
  kind!: string;

  @Column({ type: 'boolean' })
  certain!: boolean;
}
