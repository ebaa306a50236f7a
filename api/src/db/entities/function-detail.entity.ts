import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { CompactGraph } from '../../analyzer-lib';
import { snapshotKey } from './snapshot-owned';

/** The wide part of a function: its stored graph, covered outcomes and (when embedded) source. */
@Entity({ name: 'function_detail' })
export class FunctionDetail {
  @snapshotKey('function_detail')
  snapshotId!: string;

  @PrimaryColumn({ name: 'function_id', type: 'text', primaryKeyConstraintName: 'PK_function_detail' })
  functionId!: string;

  /** Kept as `json` (checked text), not `jsonb`: it is only ever read whole, and text goes in faster. */
  @Column({ type: 'json' })
  graph!: CompactGraph;

  /** Per decision: [true covered, false covered]. */
  @Column({ name: 'coverage_outcomes', type: 'json', nullable: true })
  coverageOutcomes!: [boolean, boolean][] | null;

  @Column({ type: 'text', nullable: true })
  source!: string | null;
}
