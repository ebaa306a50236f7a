import { Column, Entity, PrimaryColumn } from 'typeorm';
import { snapshotKey } from './snapshot-owned';

/** An import of one scanned file by another. */
@Entity({ name: 'import_edge' })
export class ImportEdgeRow {
  @snapshotKey('import_edge')
  snapshotId!: string;

  @PrimaryColumn({ type: 'integer', primaryKeyConstraintName: 'PK_import_edge' })
  ordinal!: number;

  @Column({ name: 'from_file', type: 'text' })
  fromFile!: string;

  @Column({ name: 'to_file', type: 'text' })
  toFile!: string;
}
