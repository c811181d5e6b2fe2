/**
 * Checks a ReportInput before drawing, so a bad value gives a sentence with its path
 * ("residuals[3].observedMs: must be a finite number") instead of a NaN on a page or a crash
 * half-way through a PDF. The model file itself was validated when it was saved.
 */
import type { ReportInput } from './types';

export class ReportInputError extends Error {
  constructor(
    readonly path: string,
    message: string,
  ) {
    super(`${path}: ${message}`);
    this.name = 'ReportInputError';
  }
}

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

function need(ok: boolean, path: string, message: string): void {
  if (!ok) throw new ReportInputError(path, message);
}

export function validateReportInput(input: ReportInput): void {
  need(finite(input.isoVelocity) && input.isoVelocity > 0, 'isoVelocity', `must be a velocity > 0 m/s (got ${input.isoVelocity})`);
  need(input.date instanceof Date && finite(input.date.getTime()), 'date', 'must be a valid date');
  need(input.run.createdAt instanceof Date && finite(input.run.createdAt.getTime()), 'run.createdAt', 'must be a valid date');
  need(input.run.order === 1 || input.run.order === 2, 'run.order', `must be 1 or 2 (got ${input.run.order})`);
  input.stations.forEach((s, i) => {
    need(finite(s.x), `stations[${i}].x`, 'must be a finite number');
    need(finite(s.z), `stations[${i}].z`, 'must be a finite number');
  });
  input.shots.forEach((s, i) => {
    need(finite(s.sourceX), `shots[${i}].sourceX`, 'must be a finite number');
    need(finite(s.sourceZ), `shots[${i}].sourceZ`, 'must be a finite number');
  });
  input.residuals.forEach((r, i) => {
    for (const key of ['receiverX', 'observedMs', 'computedMs', 'residualMs'] as const) need(finite(r[key]), `residuals[${i}].${key}`, 'must be a finite number');
    need(finite(r.sigmaMs) && r.sigmaMs > 0, `residuals[${i}].sigmaMs`, 'must be > 0');
  });
  const { grid, times, rays, source } = input.section;
  const m = input.model.file.grid;
  need(grid.nx === m.nx && grid.nz === m.nz && grid.dx === m.dx && grid.dz === m.dz && grid.x0 === m.x0 && grid.z0 === m.z0, 'section.grid', 'must be the grid of the model');
  need(times.length === grid.nx * grid.nz, 'section.times', `must hold nx·nz = ${grid.nx * grid.nz} values (got ${times.length})`);
  need(finite(source.x) && finite(source.z), 'section.source', 'must be a finite position');
  rays.forEach((r, i) => need(r.points.length % 2 === 0 && r.points.every(finite), `section.rays[${i}].points`, 'must be finite x, z pairs'));
}
