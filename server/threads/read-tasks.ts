/**
 * The heavy parts of reads, run on a worker thread (server/threads/read-pool.ts) so the API's
 * event loop keeps answering: rasterising a model version (up to 2 M nodes) and a pick set's
 * quality checks (up to 200 000 picks). Pure apart from gzip; inputs and outputs are plain data.
 */
import { gzipSync } from 'node:zlib';
import { rasteriseModel, type ModelFile } from '../../shared/model';
import { summariseRaster } from '../../shared/model/summary';
import { runPickQc, type QcPick } from '../../shared/qc';

export interface RasterTask {
  kind: 'raster';
  model: ModelFile;
}
export interface RasterResult {
  summary: { grid: ReturnType<typeof rasteriseModel>['grid'] } & ReturnType<typeof summariseRaster>;
  /** Float32 little-endian velocities, row-major iz outer, air NaN; gzip'd. */
  velocityGz: Uint8Array;
}

export interface PickQcTask {
  kind: 'pickQc';
  shotIds: string[];
  sourceX: Float64Array;
  receiverX: Float64Array;
  time: Float64Array;
  sigma: Float64Array;
  /** 1 for excluded picks (the revision's exclusions). */
  excluded: Uint8Array;
  reciprocalToleranceS: number;
}

export default function run(task: RasterTask | PickQcTask): RasterResult | ReturnType<typeof runPickQc> {
  if (task.kind === 'raster') return raster(task.model);
  const picks: QcPick[] = task.shotIds.map((shotId, i) => ({
    index: i, shotId, sourceX: task.sourceX[i], receiverX: task.receiverX[i], time: task.time[i], sigma: task.sigma[i], excluded: task.excluded[i] === 1,
  }));
  return runPickQc(picks, { reciprocalToleranceS: task.reciprocalToleranceS });
}

export function raster(model: ModelFile): RasterResult {
  const r = rasteriseModel(model);
  const out = new Float32Array(r.velocity);
  for (let i = 0; i < out.length; i++) if (!r.active[i]) out[i] = Number.NaN;
  // Float32Array is little-endian on every platform Node runs on here (x86-64, arm64).
  const velocityGz = gzipSync(new Uint8Array(out.buffer), { level: 1 });
  return { summary: { grid: r.grid, ...summariseRaster(r) }, velocityGz };
}
