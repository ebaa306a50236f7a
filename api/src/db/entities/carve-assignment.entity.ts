import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { CarvePlanRow } from './carve-plan.entity';

/** One module of a carve plan and the service it goes to. */
@Entity({ name: 'carve_assignment' })
export class CarveAssignment {
  @PrimaryColumn({ name: 'plan_id', type: 'uuid', primaryKeyConstraintName: 'PK_carve_assignment' })
  planId!: string;

  @ManyToOne(() => CarvePlanRow, (p) => p.assignments, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'plan_id', foreignKeyConstraintName: 'FK_carve_assignment_plan' })
  plan?: CarvePlanRow;

  @PrimaryColumn({ name: 'module_id', type: 'text', primaryKeyConstraintName: 'PK_carve_assignment' })
  moduleId!: string;

  @Column({ type: 'varchar', length: 120 })
  service!: string;
}
