import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/**
 * One immutable version of a velocity model of a line. Versions of the same `name` count up from 1;
 * `content` is the model file exactly as validated (FORMATS.md §1).
 */
@Entity('velocity_models')
export class VelocityModel {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'line_id' })
  lineId: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'integer' })
  version: number;

  @Column({ type: 'text', default: '' })
  comment: string;

  /** The version this one was started from, if any. */
  @Column({ type: 'uuid', name: 'based_on', nullable: true })
  basedOn: string | null;

  @Column({ type: 'jsonb', select: false })
  content: object;

  @Column({ type: 'integer' })
  nx: number;

  @Column({ type: 'integer' })
  nz: number;

  @Column({ type: 'uuid', name: 'created_by', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
