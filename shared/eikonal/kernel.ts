/**
 * The compiled march (kernel/march.as.ts) loaded for one grid: its memory holds the node arrays,
 * the cells, the surface inputs and the heap, and the typed arrays here are views on it, so the
 * solver fills them in place and reads the times back without copying. The module is compiled
 * once per thread from the bytes in kernel/march-wasm.ts (built by `npm run build:kernel`, checked
 * against its source by a test) and works the same in the browser, the worker and the command line.
 */
import { MARCH_WASM_BASE64 } from './kernel/march-wasm';
import { AIR } from './node-state';
import { referenceLogSlope } from './reference';

interface KernelExports {
  memory: WebAssembly.Memory;
  dataEnd(): number;
  setLayout(
    nx: number, nz: number, dx: number, dz: number, x0: number, z0: number,
    f: number, state: number, smooth: number, safe: number, cellS: number, cellC: number, cos: number, sin: number, horizon: number,
    keys: number, nodes: number, pos: number,
    velocity: number, active: number, nearAir: number, slowness: number, times: number,
  ): void;
  resetNodes(withNearAir: boolean): number;
  copyTimes(): void;
  heapSize(): number;
  heapClear(): void;
  heapPushOrDecrease(node: number, key: number): void;
  heapUpdate(node: number, key: number): void;
  heapPop(): number;
  march(
    xs: number, zs: number, s0: number, vs: number, gx: number, gz: number,
    factored: boolean, second: boolean, anyContrast: boolean, noStaircase: boolean, hasAfter: boolean,
  ): void;
}

/** What a march needs beyond the arrays (see kernel/march.as.ts). */
export interface MarchScheme {
  /** Source position (m). */
  xs: number;
  zs: number;
  /** Slowness at the source (s/m), the factored U of a node sitting exactly on it. */
  s0: number;
  /** Velocity (m/s) and its gradient (1/s, x and elevation) at the source, for the near-axis reference. */
  vs: number;
  gx: number;
  gz: number;
  factored: boolean;
  second: boolean;
  /** Whether any cell is a contrast cell (lets the march skip the edge look-ups). */
  anyContrast: boolean;
  /** The exact surface is handled by afterAccept and the start region: skip the mask-based candidates. */
  noStaircase: boolean;
}

/** The heap's operations, for the start nodes and the surface links. */
export interface KernelHeap {
  readonly size: number;
  clear(): void;
  pushOrDecrease(node: number, key: number): void;
  update(node: number, key: number): void;
  pop(): number;
}

let compiled: WebAssembly.Module | undefined;

function kernelModule(): WebAssembly.Module {
  if (!compiled) {
    const text = atob(MARCH_WASM_BASE64);
    const bytes = new Uint8Array(text.length);
    for (let i = 0; i < text.length; i++) bytes[i] = text.charCodeAt(i);
    compiled = new WebAssembly.Module(bytes);
  }
  return compiled;
}

const PAGE = 65536;

export class MarchKernel {
  /** Per node of the bordered grid: T, U, slowness (node-state.ts). */
  readonly F: Float64Array;
  readonly state: Uint8Array;
  /** Where second order may be used (node-state.ts smoothTriples); the solver keeps it per model. */
  readonly smooth: Uint8Array;
  /** Safe minimum of a node whose key is provisional. */
  readonly safe: Float64Array;
  /** Per cell: slowness where the march reads it, and whether it is a contrast cell. */
  readonly cellS: Float64Array;
  readonly cellC: Uint8Array;
  /** Per column: the surface's cos and |sin| of dip, and the source's horizon (surface.ts). */
  readonly surfaceCos: Float64Array;
  readonly surfaceSin: Float64Array;
  readonly horizon: Float64Array;
  readonly heap: KernelHeap;
  /** Per node of the grid (not bordered): the velocities and ground mask of a solve, put in by the solver. */
  readonly velocity: Float64Array;
  readonly active: Uint8Array;
  /** Per node of the bordered grid: NEAR_AIR flags (node-state.ts airNeighbours) for the mask-based surface candidates. */
  readonly nearAir: Uint8Array;
  /** Per node of the grid: slowness (s/m, +∞ in the air) of the last reset. */
  readonly slowness: Float64Array;
  /** Per node of the grid: the times of the last march (copyTimes), in the velocities' place: they are read by then. */
  readonly times: Float64Array;
  private readonly x: KernelExports;
  private afterAccept: ((p: number) => void) | undefined;

  constructor(nx: number, nz: number, dx: number, dz: number, x0: number, z0: number) {
    const memory = new WebAssembly.Memory({ initial: 1 });
    const instance = new WebAssembly.Instance(kernelModule(), {
      env: {
        memory,
        referenceLogSlope,
        hypot: Math.hypot,
        afterAccept: (p: number) => this.afterAccept?.(p),
      },
    });
    const x = instance.exports as unknown as KernelExports;
    const bordered = (nx + 2) * (nz + 2);
    const cells = (nx - 1) * (nz - 1);
    const n = nx * nz;
    // Lay the arrays out after the module's own data, 8-byte aligned; grow the memory once, before
    // any view is made (a later growth would detach them).
    let end = align8(x.dataEnd());
    const take = (bytes: number): number => {
      const at = end;
      end = align8(end + bytes);
      return at;
    };
    const at = {
      F: take(24 * bordered), safe: take(8 * bordered), keys: take(8 * (bordered + 1)), cellS: take(8 * cells),
      velocity: take(8 * n), slowness: take(8 * n), cos: take(8 * nx), sin: take(8 * nx), horizon: take(8 * nx),
      nodes: take(4 * (bordered + 1)), pos: take(4 * bordered), state: take(bordered), smooth: take(bordered), nearAir: take(bordered), active: take(n), cellC: take(cells),
    };
    const pages = Math.ceil(end / PAGE);
    if (pages > 1) memory.grow(pages - 1);
    const buf = memory.buffer;
    this.F = new Float64Array(buf, at.F, 3 * bordered);
    this.safe = new Float64Array(buf, at.safe, bordered);
    this.cellS = new Float64Array(buf, at.cellS, cells);
    this.cellC = new Uint8Array(buf, at.cellC, cells);
    this.surfaceCos = new Float64Array(buf, at.cos, nx);
    this.surfaceSin = new Float64Array(buf, at.sin, nx);
    this.horizon = new Float64Array(buf, at.horizon, nx);
    this.state = new Uint8Array(buf, at.state, bordered).fill(AIR); // the border stays AIR for good
    this.smooth = new Uint8Array(buf, at.smooth, bordered);
    this.velocity = new Float64Array(buf, at.velocity, n);
    this.active = new Uint8Array(buf, at.active, n);
    this.nearAir = new Uint8Array(buf, at.nearAir, bordered);
    this.slowness = new Float64Array(buf, at.slowness, n);
    this.times = this.velocity;
    new Int32Array(buf, at.pos, bordered).fill(-1); // no node in the heap
    x.setLayout(nx, nz, dx, dz, x0, z0, at.F, at.state, at.smooth, at.safe, at.cellS, at.cellC, at.cos, at.sin, at.horizon, at.keys, at.nodes, at.pos,
      at.velocity, at.active, at.nearAir, at.slowness, at.velocity);
    this.x = x;
    this.heap = {
      get size() {
        return x.heapSize();
      },
      clear: () => x.heapClear(),
      pushOrDecrease: (node, key) => x.heapPushOrDecrease(node, key),
      update: (node, key) => x.heapUpdate(node, key),
      pop: () => x.heapPop(),
    };
  }

  /**
   * Slowness per node from `velocity` (put in first), and every node back to its start state.
   * Returns whether the slownesses are those of the last reset.
   */
  resetNodes(withNearAir: boolean): boolean {
    return this.x.resetNodes(withNearAir) !== 0;
  }

  /** The march's times into `times`. */
  copyTimes(): void {
    this.x.copyTimes();
  }

  /** Marches from the nodes in the heap until it is empty; `afterAccept` runs after each acceptance. */
  march(s: MarchScheme, afterAccept?: (p: number) => void): void {
    this.afterAccept = afterAccept;
    try {
      this.x.march(s.xs, s.zs, s.s0, s.vs, s.gx, s.gz, s.factored, s.second, s.anyContrast, s.noStaircase, afterAccept !== undefined);
    } finally {
      this.afterAccept = undefined;
    }
  }
}

function align8(n: number): number {
  return (n + 7) & ~7;
}
