/**
 * Slowness of the grid cells that a layer interface crosses, from samples inside each cell.
 *
 * Node velocities are point samples, so two models whose interface lies anywhere between the same
 * two node rows rasterise to the same nodes; the solver alone puts every such interface on one
 * row, up to a cell too deep (2–3 % on head-wave times at 0.5 m cells, measured). Sampling the
 * cell carries the sub-cell position. The value given to the cell is chosen for the waves a
 * refraction survey records, head waves (ours, derived for this purpose):
 *
 *   s_cell² = s_f² + (mean over samples of √(s² − s_f²))²,   s_f the fastest sample's slowness.
 *
 * A head wave runs along the interface at s_f and crosses the rest of the cell at the slowness
 * component √(s² − s_f²) of each part, so a cell with slow fraction f of s_1 over s_2 gets
 * s² = s_2² + f²·(s_1² − s_2²): exact for a head wave along a flat interface at any depth in the
 * cell, s_1 when the cell is all slow, s_2 when all fast. (The plain mean slowness, right for a
 * ray crossing the cell steeply, left up to 0.5 % on head waves; this rule 0.34 %, measured in
 * tests/references/model.) A ray crossing such a cell near the normal is up to (mean − s_cell)·dz
 * early. Samples sit at the centres of an 8 × 32 sub-grid, finer in depth where interfaces are
 * mostly near-horizontal.
 *
 * Only cells whose four corners are ground, unpainted and not all in one layer are sampled;
 * other cells are NaN (the solver keeps its own rule there).
 */
import { nodeX, nodeZ, type Grid } from '../grid';
import type { ModelLayer } from '../schemas/model';
import { layerColumnAt, layerIndexAt, layerVelocityAt, newLayerColumn, type LayerColumn } from './layer-column';

export const SAMPLES_X = 8;
export const SAMPLES_Z = 32;

/**
 * `layerOf` is each node's layer index (−1 for a painted node). Returns (nx−1)·(nz−1) values,
 * index cz·(nx−1)+cx, NaN where not sampled.
 */
export function interfaceCellSlowness(
  grid: Grid,
  layers: readonly ModelLayer[],
  surfaceZ: (x: number) => number,
  layerOf: Int32Array,
  active: Uint8Array,
): Float32Array {
  const { nx, nz, dx, dz } = grid;
  const ncx = nx - 1;
  const out = new Float32Array(ncx * (nz - 1)).fill(NaN);
  const eps = 1e-6 * dz;
  const zBottom = nodeZ(grid, nz - 1);
  const columns: LayerColumn[] = Array.from({ length: SAMPLES_X }, () => newLayerColumn(layers.length));
  const samples = new Float64Array(SAMPLES_X * SAMPLES_Z);
  for (let cx = 0; cx < ncx; cx++) {
    let columnsReady = false;
    for (let cz = 0; cz < nz - 1; cz++) {
      const i = cz * nx + cx;
      const corners = [i, i + 1, i + nx, i + nx + 1];
      if (!corners.every((c) => active[c] && layerOf[c] >= 0)) continue;
      if (corners.every((c) => layerOf[c] === layerOf[i])) continue;
      if (!columnsReady) {
        for (let sx = 0; sx < SAMPLES_X; sx++) {
          const x = nodeX(grid, cx) + ((sx + 0.5) / SAMPLES_X) * dx;
          layerColumnAt(layers, x, surfaceZ(x), zBottom, columns[sx]);
        }
        columnsReady = true;
      }
      sampleCell(layers, columns, nodeZ(grid, cz), dz, eps, samples);
      out[cz * ncx + cx] = headWaveSlowness(samples);
    }
  }
  return out;
}

/** Slowness (s/m) at the centres of the cell's sub-grid; the cell's top edge is at elevation zTop. */
function sampleCell(layers: readonly ModelLayer[], columns: LayerColumn[], zTop: number, dz: number, eps: number, out: Float64Array): void {
  let n = 0;
  for (const col of columns) {
    let k = 0;
    for (let sz = 0; sz < SAMPLES_Z; sz++) {
      const z = zTop - ((sz + 0.5) / SAMPLES_Z) * dz;
      k = layerIndexAt(col, z, eps, k);
      out[n++] = 1 / layerVelocityAt(layers[k], col, k, z, eps);
    }
  }
}

/** s² = s_f² + (mean √(s² − s_f²))², s_f the least sample (see the file comment). */
export function headWaveSlowness(samples: Float64Array): number {
  let sf = Infinity;
  for (const s of samples) if (s < sf) sf = s;
  let across = 0;
  for (const s of samples) across += Math.sqrt(s * s - sf * sf);
  across /= samples.length;
  return Math.sqrt(sf * sf + across * across);
}
