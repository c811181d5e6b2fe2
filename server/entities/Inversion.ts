import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { Grid } from '../../shared/grid';
import type { InversionSettings } from '../../shared/inversion/types';

export type InversionStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';

/**
 * One travel-time inversion of a pick-set revision, with its exact inputs (start, grid, surface,
 * settings); its job id in the queue is this id. Iterations, result and residuals live in
 * inversion_iterations, inversion_results and inversion_residuals (migration 1796419332383).
 */
@Entity('inversions')
export class Inversion {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'line_id' })
  lineId: string;

  @Column({ type: 'uuid', name: 'pick_set_id' })
  pickSetId: string;

  @Column({ type: 'integer', name: 'pick_set_revision' })
  pickSetRevision: number;

  @Column({ type: 'text', name: 'start_kind' })
  startKind: 'gradient' | 'model';

  @Column({ type: 'uuid', name: 'start_model_id', nullable: true })
  startModelId: string | null;

  @Column({ type: 'double precision', name: 'start_spacing', nullable: true })
  startSpacing: number | null;

  @Column({ type: 'double precision', name: 'start_v0', nullable: true })
  startV0: number | null;

  @Column({ type: 'double precision', name: 'start_k', nullable: true })
  startK: number | null;

  @Column({ type: 'jsonb' })
  grid: Grid;

  @Column({ type: 'jsonb', nullable: true })
  surface: [number, number][] | null;

  @Column({ type: 'jsonb' })
  settings: InversionSettings;

  @Column({ type: 'text', default: '' })
  label: string;

  @Column({ type: 'text', default: 'queued' })
  status: InversionStatus;

  @Column({ type: 'integer' })
  shots: number;

  @Column({ type: 'integer' })
  picks: number;

  @Column({ type: 'double precision', name: 'next_smoothing', nullable: true })
  nextSmoothing: number | null;

  @Column({ type: 'double precision', nullable: true })
  scale: number | null;

  @Column({ type: 'text', nullable: true })
  error: string | null;

  @Column({ type: 'jsonb', nullable: true })
  stats: object | null;

  @Column({ type: 'integer', default: 0 })
  attempts: number;

  @Column({ type: 'uuid', name: 'saved_model_id', nullable: true })
  savedModelId: string | null;

  @Column({ type: 'uuid', name: 'created_by', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @Column({ type: 'timestamptz', name: 'started_at', nullable: true })
  startedAt: Date | null;

  @Column({ type: 'timestamptz', name: 'finished_at', nullable: true })
  finishedAt: Date | null;
}
