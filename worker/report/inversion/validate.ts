/**
 * Checks an InversionReportInput before drawing, so a bad value gives a sentence with its path
 * ("inversion.history[2].chi2: must be a finite number ≥ 0") instead of a NaN on a page or a crash
 * half-way through a PDF. Air is NaN or null in the node arrays; anything else must be a number.
 */
import { ReportInputError } from '../validate';
import type { InversionReportInput, NodeValues } from './types';

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
const air = (v: unknown): boolean => v === null || (typeof v === 'number' && Number.isNaN(v));

function need(ok: boolean, path: string, message: string): void {
  if (!ok) throw new ReportInputError(path, message);
}

function nodeArray(values: NodeValues | undefined, length: number, path: string, ok: (v: number) => boolean, what: string): void {
  need(values != null && typeof values.length === 'number', path, 'must be an array of node values');
  need(values!.length === length, path, `must hold ${length} values (got ${values!.length})`);
  for (let i = 0; i < length; i++) {
    const v = values![i];
    if (!air(v)) need(finite(v) && ok(v), `${path}[${i}]`, `must be ${what}, or null in the air (got ${v})`);
  }
}

export function validateInversionReportInput(input: InversionReportInput): void {
  need(input.date instanceof Date && finite(input.date.getTime()), 'date', 'must be a valid date');
  need(finite(input.isoVelocity) && input.isoVelocity > 0, 'isoVelocity', `must be a velocity > 0 m/s (got ${input.isoVelocity})`);
  if (input.coverageThreshold !== undefined) need(finite(input.coverageThreshold) && input.coverageThreshold >= 0, 'coverageThreshold', `must be a ray length ≥ 0 m (got ${input.coverageThreshold})`);
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

  const inv = input.inversion;
  need(inv.createdAt instanceof Date && finite(inv.createdAt.getTime()), 'inversion.createdAt', 'must be a valid date');
  const g = inv.grid;
  for (const k of ['nx', 'nz'] as const) need(Number.isInteger(g[k]) && g[k] >= 2, `inversion.grid.${k}`, `must be a whole number ≥ 2 (got ${g[k]})`);
  for (const k of ['dx', 'dz'] as const) need(finite(g[k]) && g[k] > 0, `inversion.grid.${k}`, `must be a spacing > 0 m (got ${g[k]})`);
  for (const k of ['x0', 'z0'] as const) need(finite(g[k]), `inversion.grid.${k}`, 'must be a finite number');
  if (inv.surface) {
    need(inv.surface.length >= 1, 'inversion.surface', 'must have at least one vertex, or be null');
    inv.surface.forEach((p, i) => {
      need(Array.isArray(p) && p.length === 2 && finite(p[0]) && finite(p[1]), `inversion.surface[${i}]`, 'must be an [x, z] pair of finite numbers');
      if (i > 0) need(p[0] > inv.surface![i - 1][0], `inversion.surface[${i}]`, 'x must increase from vertex to vertex');
    });
  }
  const n = g.nx * g.nz;
  nodeArray(inv.velocity, n, 'inversion.velocity', (v) => v > 0, 'a velocity > 0 m/s');
  let ground = 0;
  for (let i = 0; i < n; i++) if (!air(inv.velocity[i])) ground++;
  need(ground > 0, 'inversion.velocity', 'has no ground node (every value is air)');
  nodeArray(inv.coverage, n, 'inversion.coverage', (v) => v >= 0, 'a ray length ≥ 0 m');
  nodeArray(inv.doi, g.nx, 'inversion.doi', () => true, 'an elevation in metres');

  need(inv.history.length > 0, 'inversion.history', 'must hold at least the starting model (iteration 0)');
  inv.history.forEach((h, i) => {
    need(Number.isInteger(h.iteration) && h.iteration >= 0, `inversion.history[${i}].iteration`, `must be a whole number ≥ 0 (got ${h.iteration})`);
    need(finite(h.chi2) && h.chi2 >= 0, `inversion.history[${i}].chi2`, `must be a finite number ≥ 0 (got ${h.chi2})`);
    need(finite(h.rmsMs) && h.rmsMs >= 0, `inversion.history[${i}].rmsMs`, `must be a finite number ≥ 0 (got ${h.rmsMs})`);
    need(h.smoothing === null || (finite(h.smoothing) && h.smoothing >= 0), `inversion.history[${i}].smoothing`, `must be a weight ≥ 0 or null (got ${h.smoothing})`);
  });

  const s = inv.settings;
  need(Number.isInteger(s.maxIterations) && s.maxIterations >= 1, 'inversion.settings.maxIterations', `must be a whole number ≥ 1 (got ${s.maxIterations})`);
  need(s.smoothing === null || (finite(s.smoothing) && s.smoothing > 0), 'inversion.settings.smoothing', `must be a weight > 0 or null (automatic) (got ${s.smoothing})`);
  need(finite(s.verticalWeight) && s.verticalWeight > 0, 'inversion.settings.verticalWeight', `must be > 0 (got ${s.verticalWeight})`);
  need(finite(s.damping) && s.damping >= 0, 'inversion.settings.damping', `must be ≥ 0 (got ${s.damping})`);
  need(finite(s.vMin) && s.vMin > 0, 'inversion.settings.vMin', `must be a velocity > 0 m/s (got ${s.vMin})`);
  need(finite(s.vMax) && s.vMax > s.vMin, 'inversion.settings.vMax', `must be greater than vMin (got ${s.vMax} and ${s.vMin} m/s)`);
  need(s.order === 1 || s.order === 2, 'inversion.settings.order', `must be 1 or 2 (got ${s.order})`);
  need(s.checkerSize === null || (finite(s.checkerSize) && s.checkerSize > 0), 'inversion.settings.checkerSize', `must be a size > 0 m or null (got ${s.checkerSize})`);

  const st = inv.start;
  if (st.kind === 'gradient') {
    for (const k of ['spacing', 'v0', 'k'] as const) need(finite(st[k]), `inversion.start.${k}`, `must be a finite number (got ${st[k]})`);
  } else if (st.kind === 'model') {
    need(Number.isInteger(st.modelVersion) && st.modelVersion >= 1, 'inversion.start.modelVersion', `must be a version number ≥ 1 (got ${st.modelVersion})`);
  } else {
    need(false, 'inversion.start.kind', `must be "gradient" or "model" (got ${(st as { kind: unknown }).kind})`);
  }

  const cb = inv.checkerboard;
  if (cb) {
    need(finite(cb.size) && cb.size > 0, 'inversion.checkerboard.size', `must be a size > 0 m (got ${cb.size})`);
    need(finite(cb.amplitude) && cb.amplitude > 0, 'inversion.checkerboard.amplitude', `must be > 0 (got ${cb.amplitude})`);
    need(air(cb.correlation) || (finite(cb.correlation) && Math.abs(cb.correlation) <= 1 + 1e-9), 'inversion.checkerboard.correlation', `must be a correlation from −1 to 1, or null (got ${cb.correlation})`);
    if (cb.coverageThreshold !== undefined) need(finite(cb.coverageThreshold) && cb.coverageThreshold >= 0, 'inversion.checkerboard.coverageThreshold', `must be a ray length ≥ 0 m (got ${cb.coverageThreshold})`);
    nodeArray(cb.truePattern, n, 'inversion.checkerboard.truePattern', () => true, 'a relative anomaly');
    nodeArray(cb.recovered, n, 'inversion.checkerboard.recovered', () => true, 'a relative anomaly');
  }
}
