import { Column, Entity, Index, PrimaryColumn } from 'typeorm';
import { snapshotKey } from './snapshot-owned';

/** One module (file, folder or package) of a snapshot with its aggregated figures and gravity. */
@Entity({ name: 'module_metric' })
@Index('ix_module_metric_level_rank', ['snapshotId', 'level', 'gravityRank'])
export class ModuleMetric {
  @snapshotKey('module_metric')
  snapshotId!: string;

  /** `<level>:<path>`. */
  @PrimaryColumn({ name: 'module_id', type: 'text', primaryKeyConstraintName: 'PK_module_metric' })
  moduleId!: string;

  @Column({ type: 'varchar', length: 8 })
  level!: string;

  @Column({ type: 'text' })
  path!: string;

  @Column({ type: 'text', nullable: true })
  name!: string | null;

  @Column({ type: 'integer' })
  functions!: number;

  @Column({ type: 'integer' })
  cyclomatic!: number;

  @Column({ type: 'integer' })
  decisions!: number;

  @Column({ type: 'integer' })
  nodes!: number;

  @Column({ type: 'integer' })
  edges!: number;

  @Column({ name: 'max_cyclomatic', type: 'integer' })
  maxCyclomatic!: number;

  @Column({ name: 'over_limit', type: 'integer' })
  overLimit!: number;

  @Column({ type: 'integer' })
  lines!: number;

  @Column({ name: 'fan_in', type: 'integer' })
  fanIn!: number;

  @Column({ name: 'fan_out', type: 'integer' })
  fanOut!: number;

  @Column({ type: 'integer' })
  ca!: number;

  @Column({ type: 'integer' })
  ce!: number;

  @Column({ type: 'double precision', nullable: true })
  instability!: number | null;

  @Column({ type: 'double precision', nullable: true })
  abstractness!: number | null;

  @Column({ name: 'design_complexity', type: 'integer' })
  designComplexity!: number;

  @Column({ name: 'integration_complexity', type: 'integer' })
  integrationComplexity!: number;

  @Column({ name: 'unresolved_calls', type: 'integer' })
  unresolvedCalls!: number;

  @Column({ name: 'external_calls', type: 'integer' })
  externalCalls!: number;

  @Column({ type: 'varchar', length: 64, nullable: true })
  cluster!: string | null;

  @Column({ type: 'double precision' })
  gravity!: number;

  @Column({ name: 'gravity_rank', type: 'integer' })
  gravityRank!: number;

  @Column({ type: 'jsonb' })
  reasons!: string[];
}
