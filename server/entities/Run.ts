import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

export type RunStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';

/** One forward solve of a model version against a pick-set revision; its job id in the queue is this id. */
@Entity('runs')
export class Run {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'line_id' })
  lineId: string;

  @Column({ type: 'uuid', name: 'model_id' })
  modelId: string;

  @Column({ type: 'uuid', name: 'pick_set_id' })
  pickSetId: string;

  @Column({ type: 'integer', name: 'pick_set_revision' })
  pickSetRevision: number;

  @Column({ type: 'smallint', name: 'scheme_order' })
  order: 1 | 2;

  @Column({ type: 'text', default: 'queued' })
  status: RunStatus;

  @Column({ type: 'integer', name: 'shots_done', default: 0 })
  shotsDone: number;

  @Column({ type: 'integer', name: 'shots_total' })
  shotsTotal: number;

  @Column({ type: 'text', nullable: true })
  error: string | null;

  @Column({ type: 'jsonb', nullable: true })
  stats: object | null;

  @Column({ type: 'integer', default: 0 })
  attempts: number;

  @Column({ type: 'uuid', name: 'created_by', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @Column({ type: 'timestamptz', name: 'started_at', nullable: true })
  startedAt: Date | null;

  @Column({ type: 'timestamptz', name: 'finished_at', nullable: true })
  finishedAt: Date | null;
}
