/**
 * Fast marching for |∇T| = s (s = 1/v) on the node grid, first-order upwind or mixed second
 * order, with the factored source treatment (source.ts) and cell slownesses at contrasts
 * (cells.ts). Nodes are accepted in time order from an indexed heap (the compiled march, kernel.ts); each newly
 * accepted node updates its four neighbours with the candidates that involve it: the edge
 * towards it (one axis) and the two cells on either side (two axes); a node keeps the least
 * causal candidate. Sethian (1999), "Level Set Methods and Fast Marching Methods", ch. 8.
 *
 * Mixed second order: an axis uses the second-order difference when the next node beyond the
 * neighbour is accepted, earlier than the neighbour, and no contrast lies along the three
 * nodes; otherwise first order (Rickett & Fomel 1999, SEP Report 100).
 */
import type { Grid } from '../grid';
import { CONTRAST_RATIO, DEFAULT_INTERFACE_RULE, type InterfaceRule } from './cells';
import { ModelCells } from './model-cells';
import { startTimes } from './source';
import { sourceHorizon, surfaceTangents } from './surface';
import { surfaceStart } from './surface-start';
import { MarchKernel } from './kernel';
import { airNeighbours, KIND, smoothTriples, TRIAL } from './node-state';
import { surfaceLinks } from './surface-links';
import type { Point, SolveOptions, VelocityField } from './types';
import { validateCellSlowness, validateGrid, validateSolveInput } from './validate';

/** Knobs beyond the public options, for the benchmark's measurements. Defaults are the chosen ones. */
export interface MarchOptions extends SolveOptions {
  /** Factored (source-singularity-free) updates; false = plain scheme with the same start. */
  factored?: boolean;
  rule?: InterfaceRule;
  contrastRatio?: number;
}

/**
 * Reusable solver for one grid: keeps its buffers between shots so a line of many shots
 * allocates once. Not safe to share between threads (each worker makes its own).
 */
export class TravelTimeSolver {
  readonly grid: Grid;
  private slow: Float64Array;
  /** The compiled march with its node arrays, cells, surface inputs and heap (kernel.ts). */
  private kernel: MarchKernel;
  /** The contrast ratio the kernel's smooth flags were worked out for (with the slownesses in F). */
  private smoothRatio: number | null = null;
  private cells = new ModelCells();
  /** The surface's direction per column for the last ground mask (kept while the mask is the same array with the same count). */
  private tangents: { active: Uint8Array; ground: number; cos: Float64Array; sin: Float64Array; top: Float64Array; nearAir: Uint8Array } | null = null;

  constructor(grid: Grid) {
    validateGrid(grid); // before allocating: an oversized grid is an input error, not a crash
    this.grid = { ...grid };
    this.kernel = new MarchKernel(grid.nx, grid.nz, grid.dx, grid.dz, grid.x0, grid.z0);
    this.slow = this.kernel.slowness;
  }

  /** Travel times (s) from `source`; Infinity at air nodes and ground not connected to the source. */
  solve(velocity: VelocityField, active: Uint8Array, source: Point, options: MarchOptions = {}, out?: Float64Array): Float64Array {
    const grid = this.grid;
    const ground = validateSolveInput(grid, velocity, active, source);
    if (options.cellSlowness) validateCellSlowness(grid, options.cellSlowness);
    const { nx, nz, dx, dz, x0, z0 } = grid;
    const n = nx * nz;
    const order = options.order ?? 2;
    const factored = options.factored ?? true;
    const ratio = options.contrastRatio ?? CONTRAST_RATIO;
    const T = out && out.length === n ? out : new Float64Array(n);
    const S = this.slow;
    const kernel = this.kernel;
    const { F, state, heap } = kernel;
    // Given the surface line, the start region and links follow it exactly; the mask-based
    // candidates stand down and their per-shot inputs are not worked out.
    const staircase = options.surface ? null : this.staircaseInputs(grid, active, ground, source);
    kernel.velocity.set(velocity);
    kernel.active.set(active);
    if (staircase) kernel.nearAir.set(staircase);
    const sameSlowness = kernel.resetNodes(staircase !== null);

    const cells = this.cells.update(grid, S, active, sameSlowness, options.rule ?? DEFAULT_INTERFACE_RULE, ratio, options.cellSlowness);
    if (!sameSlowness || this.smoothRatio !== ratio) {
      smoothTriples(F, nx, nz, ratio, kernel.smooth);
      this.smoothRatio = ratio;
    }
    const anyContrast = this.cells.anyContrast;
    if (anyContrast) {
      kernel.cellS.set(cells.value);
      kernel.cellC.set(cells.contrast);
    }
    heap.clear();

    const xs = source.x;
    const zs = source.z;
    const start = startTimes(grid, S, active, source, ratio, !options.surface);
    const near = options.surface ? surfaceStart(grid, S, active, source, start.slowness, options.surface) : { nodes: [], times: [] };
    const startNodes = start.nodes.concat(near.nodes);
    const startTimesAll = start.times.concat(near.times);
    for (let k = 0; k < startNodes.length; k++) {
      const i = startNodes[k];
      const ix = i % nx;
      const iz = (i - ix) / nx;
      const b = (iz + 1) * (nx + 2) + ix + 1; // on the bordered grid
      if ((state[b] & KIND) === TRIAL && F[3 * b] <= startTimesAll[k]) continue; // a node in both lists keeps the earlier time
      F[3 * b] = startTimesAll[k];
      F[3 * b + 1] = Math.hypot(x0 + ix * dx - xs, z0 - iz * dz - zs); // r, as march keeps it
      heap.pushOrDecrease(b, startTimesAll[k]);
      state[b] = (state[b] & ~KIND) | TRIAL;
    }
    const links = options.surface && options.surface.length >= 2
      ? surfaceLinks(grid, S, active, options.surface, { F, state, safe: kernel.safe, heap, xs, zs, factored })
      : undefined;
    kernel.march(
      {
        xs, zs,
        s0: start.slowness,
        vs: 1 / start.slowness,
        gx: start.gradX,
        gz: start.gradZ,
        factored,
        second: order === 2,
        anyContrast,
        noStaircase: options.surface !== undefined,
      },
      links,
    );
    kernel.copyTimes();
    T.set(kernel.times);
    return T;
  }

  /**
   * The mask-based surface candidates' inputs, put in the kernel: per mask the surface's direction
   * per column; per shot the horizon. Returns the nodes next to the air (per mask).
   */
  private staircaseInputs(grid: Grid, active: Uint8Array, ground: number, source: Point): Uint8Array {
    if (this.tangents?.active !== active || this.tangents?.ground !== ground) {
      this.tangents = { active, ground, ...surfaceTangents(grid, active), nearAir: airNeighbours(active, grid.nx, grid.nz) };
    }
    const t = this.tangents;
    this.kernel.surfaceCos.set(t.cos);
    this.kernel.surfaceSin.set(t.sin);
    sourceHorizon(grid, t.top, source, this.kernel.horizon);
    return t.nearAir;
  }

}

/** Travel times (s) from `source` on `grid`; Infinity at air nodes. Throws EikonalInputError on bad input. */
export function solveTravelTimes(
  grid: Grid,
  velocity: VelocityField,
  active: Uint8Array,
  source: Point,
  options?: SolveOptions,
): Float64Array {
  return new TravelTimeSolver(grid).solve(velocity, active, source, options);
}


