/**
 * What the rays of the final model saw: summed ray length per node (the column sums of the
 * ray-length matrix, the usual "derivative weight sum" of tomography; common practice, no
 * source), the number of rays touching each node, and the depth of investigation per grid
 * column: the lowest point any ray reaches there, i.e. the lower envelope of the rays, which for
 * diving waves is the envelope of their turning points.
 */
import type { ForwardResult } from './types';

export function rayCoverage(nodes: number, f: ForwardResult, used?: Uint8Array): { coverage: Float32Array; hits: Int32Array } {
  const coverage = new Float32Array(nodes);
  const hits = new Int32Array(nodes);
  const rows = f.rowPtr.length - 1;
  for (let r = 0; r < rows; r++) {
    if (used && !used[r]) continue;
    for (let k = f.rowPtr[r]; k < f.rowPtr[r + 1]; k++) {
      coverage[f.cols[k]] += f.vals[k];
      hits[f.cols[k]]++;
    }
  }
  return { coverage, hits };
}

export function depthOfInvestigation(f: ForwardResult): Float64Array {
  return Float64Array.from(f.rayBottom, (z) => (Number.isFinite(z) ? z : Number.NaN));
}
