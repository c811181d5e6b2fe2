/**
 * The march's per-node bookkeeping, shared by the solver's set-up (fmm.ts), the surface links and
 * the compiled march (kernel/march.as.ts, which repeats these numbers: keep them in step).
 *
 * Node arrays (time, factored time, slowness interleaved in F; the state byte; the safe minimum)
 * cover the grid with a border one node wide all round, kept AIR, so a neighbour one step off the
 * grid is simply never usable and the march needs no bounds tests: node (ix, iz) sits at
 * (iz + 1)·(nx + 2) + ix + 1. F[3i] = T (travel time, the heap key), F[3i+1] = U (T/r factored, or
 * T plain; set on acceptance; before that, in the factored scheme, the node's distance r to the
 * source), F[3i+2] = slowness.
 */

/** Node kinds in the low two bits of the state byte. */
export const FAR = 0;
export const TRIAL = 1;
export const DONE = 2;
export const AIR = 3;
export const KIND = 3;
/** Flag: the node's key is a provisional near-axis value (its safe minimum is in `safe`). */
export const PROVISIONAL = 4;
/** Flag: the node has had a causal two-axis candidate. */
export const HAS_TWO = 8;
/**
 * Flag, set before the march and kept: a ground node with air above it (the grid's top row counts:
 * with no surface given the ground starts there) or beside it, inside the grid (airNeighbours).
 */
export const NEAR_AIR = 16;

/** Bits of the kernel's smooth array: the node and its two neighbours along x (along z) are one smooth medium. */
export const SMOOTH_X = 1;
export const SMOOTH_Z = 2;

/**
 * Marks each node whose slowness and its two neighbours' along an axis lie within `ratio` of each
 * other (no contrast inside the three nodes): a second-order difference through the node is used
 * only there. It depends on the slownesses alone, so the solver works it out once per model, not
 * in every update. F as the march's node arrays (slowness in F[3i+2]).
 */
export function smoothTriples(F: Float64Array, nx: number, nz: number, ratio: number, out: Uint8Array): void {
  const stride = nx + 2;
  for (let iz = 0; iz < nz; iz++) {
    for (let ix = 0, b = (iz + 1) * stride + 1; ix < nx; ix++, b++) {
      const s = F[3 * b + 2];
      out[b] = (oneMedium(F[3 * (b - 1) + 2], s, F[3 * (b + 1) + 2], ratio) ? SMOOTH_X : 0) |
        (oneMedium(F[3 * (b - stride) + 2], s, F[3 * (b + stride) + 2], ratio) ? SMOOTH_Z : 0);
    }
  }
}

function oneMedium(s1: number, s2: number, s3: number, ratio: number): boolean {
  return Math.max(s1, s2, s3) <= Math.min(s1, s2, s3) * ratio;
}

/** NEAR_AIR per node of the bordered grid (0 elsewhere), from the ground mask. */
export function airNeighbours(active: Uint8Array, nx: number, nz: number): Uint8Array {
  const stride = nx + 2;
  const out = new Uint8Array(stride * (nz + 2));
  for (let iz = 0; iz < nz; iz++) {
    for (let ix = 0; ix < nx; ix++) {
      const i = iz * nx + ix;
      if (!active[i]) continue;
      const airAbove = iz === 0 || !active[i - nx];
      const airBeside = (ix > 0 && !active[i - 1]) || (ix < nx - 1 && !active[i + 1]);
      if (airAbove || airBeside) out[(iz + 1) * stride + ix + 1] = NEAR_AIR;
    }
  }
  return out;
}
