import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** An uploaded pick file: immutable once stored. Its picks live in `picks`, exclusions in revisions. */
@Entity('pick_sets')
export class PickSet {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'line_id' })
  lineId: string;

  @Column({ type: 'text', name: 'file_name' })
  fileName: string;

  @Column({ type: 'integer', name: 'size_bytes' })
  sizeBytes: number;

  /** The file exactly as uploaded. Not selected by default: it can be megabytes. */
  @Column({ type: 'bytea', select: false })
  original: Buffer;

  @Column({ type: 'integer', name: 'shot_count' })
  shotCount: number;

  @Column({ type: 'integer', name: 'pick_count' })
  pickCount: number;

  @Column({ type: 'uuid', name: 'created_by', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
