import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Brief } from './brief.entity';
import { User } from './user.entity';

/** A reviewer's comment on a brief, optionally anchored to one of its sections. */
@Entity({ name: 'comment' })
@Index('ix_comment_brief', ['briefId', 'createdAt'])
export class Comment {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_comment' })
  id!: string;

  @Column({ name: 'brief_id', type: 'uuid' })
  briefId!: string;

  @ManyToOne(() => Brief, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'brief_id', foreignKeyConstraintName: 'FK_comment_brief' })
  brief?: Brief;

  @Column({ name: 'author_id', type: 'uuid', nullable: true })
  authorId!: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'author_id', foreignKeyConstraintName: 'FK_comment_author' })
  author?: User | null;

  @Column({ type: 'text' })
  body!: string;

  @Column({ type: 'varchar', length: 120, nullable: true })
  anchor!: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
