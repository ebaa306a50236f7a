import { Column, Entity, Index, PrimaryColumn } from 'typeorm';
import { snapshotKey } from './snapshot-owned';

/**
 * One function unit of a snapshot with its metrics: the narrow row the functions table sorts,
 * filters and pages (the graph and coverage detail live in function_detail).
 */
@Entity({ name: 'function_metric' })
@Index('ix_function_metric_cyclomatic', ['snapshotId', 'cyclomatic', 'functionId'])
@Index('ix_function_metric_file', ['snapshotId', 'file'])
@Index('ix_function_metric_folder', ['snapshotId', 'folder'])
@Index('ix_function_metric_cluster', ['snapshotId', 'cluster'])
@Index('ix_function_metric_essential', ['snapshotId', 'essential', 'functionId'])
@Index('ix_function_metric_over_limit', ['snapshotId'], { where: 'over_limit' })
export class FunctionMetric {
  @snapshotKey('function_metric')
  snapshotId!: string;

  /** The analyzer's stable id (file, qualified name, ordinal). */
  @PrimaryColumn({ name: 'function_id', type: 'text', primaryKeyConstraintName: 'PK_function_metric' })
  functionId!: string;

  /** Position in the snapshot's own order, so exports give back the analyzer's order. */
  @Column({ type: 'integer' })
  ordinal!: number;

  @Column({ type: 'text' })
  name!: string;

  @Column({ name: 'qualified_name', type: 'text' })
  qualifiedName!: string;

  @Column({ type: 'varchar', length: 24 })
  kind!: string;

  @Column({ type: 'text' })
  file!: string;

  /** Folder and package module ids the function falls in (null without a module map). */
  @Column({ type: 'text', nullable: true })
  folder!: string | null;

  @Column({ type: 'text', nullable: true })
  package!: string | null;

  /** The file-level cluster of its file. */
  @Column({ type: 'varchar', length: 64, nullable: true })
  cluster!: string | null;

  @Column({ type: 'integer' })
  line!: number;

  @Column({ name: 'end_line', type: 'integer' })
  endLine!: number;

  @Column({ type: 'integer' })
  loc!: number;

  @Column({ type: 'integer' })
  cyclomatic!: number;

  @Column({ name: 'cyclomatic_strict', type: 'integer' })
  cyclomaticStrict!: number;

  @Column({ type: 'integer' })
  decisions!: number;

  @Column({ type: 'integer' })
  nodes!: number;

  @Column({ type: 'integer' })
  edges!: number;

  @Column({ type: 'integer' })
  essential!: number;

  @Column({ name: 'design_complexity', type: 'integer', nullable: true })
  designComplexity!: number | null;

  @Column({ type: 'varchar', length: 64 })
  fingerprint!: string;

  @Column({ name: 'unresolved_calls', type: 'integer' })
  unresolvedCalls!: number;

  @Column({ name: 'external_calls', type: 'integer' })
  externalCalls!: number;

  /** Severity band of V(G) (see the analyzer's severityBand). */
  @Column({ type: 'varchar', length: 16 })
  band!: string;

  @Column({ name: 'over_limit', type: 'boolean' })
  overLimit!: boolean;

  /** Coverage figures, present once a report was imported. */
  @Column({ name: 'outcomes_covered', type: 'integer', nullable: true })
  outcomesCovered!: number | null;

  @Column({ name: 'outcomes_total', type: 'integer', nullable: true })
  outcomesTotal!: number | null;

  @Column({ name: 'actual_complexity', type: 'integer', nullable: true })
  actualComplexity!: number | null;

  @Column({ name: 'untested_paths', type: 'integer', nullable: true })
  untestedPaths!: number | null;

  @Column({ type: 'double precision', nullable: true })
  crap!: number | null;
}
