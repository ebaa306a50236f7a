import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Brief } from './brief.entity';
import { User } from './user.entity';

export const DECISION_OUTCOMES = ['approve', 'revise', 'decline'] as const;

/** What a reviewer decided on a brief, and why. */
@Entity({ name: 'decision' })
@Check('CK_decision_outcome', `"outcome" IN ('approve', 'revise', 'decline')`)
@Index('ix_decision_brief', ['briefId', 'createdAt'])
export class Decision {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_decision' })
  id!: string;

  @Column({ name: 'brief_id', type: 'uuid' })
  briefId!: string;

  @ManyToOne(() => Brief, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'brief_id', foreignKeyConstraintName: 'FK_decision_brief' })
  brief?: Brief;

  @Column({ type: 'varchar', length: 16 })
  outcome!: (typeof DECISION_OUTCOMES)[number];

  @Column({ type: 'text', default: '' })
  rationale!: string;

  @Column({ name: 'decided_by', type: 'uuid', nullable: true })
  decidedById!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'decided_by', foreignKeyConstraintName: 'FK_decision_decided_by' })
  decidedBy?: User | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
