/**
 * The fast-marching loop itself, written flat for speed (no closures, no allocation, index maths
 * inline, no bounds tests: the node arrays have an AIR border, see MarchState.stride). fmm.ts
 * prepares the arrays; the stencil algebra is that of stencil.ts, repeated here inline because a
 * call per candidate costs more than the arithmetic.
 *
 * Each accepted node p updates its four neighbours q with the candidates that involve p:
 * the one-axis update towards p, and the two-axis updates with each accepted neighbour b of q
 * on the other axis (the cell q–p–b). q keeps the least causal candidate (t ≥ T_p, t ≥ T_b).
 */
import type { IndexedMinHeap } from './heap';
import { referenceLogSlope } from './reference';

export interface MarchState {
  /** Grid size in nodes (for positions and cell indices). */
  nx: number;
  nz: number;
  /**
   * Row length of the node arrays (F, state, safe, heap ids): the grid with a border one node wide
   * all round, kept AIR, so a neighbour one step off the grid is simply never usable and the loop
   * needs no bounds tests. Node (ix, iz) sits at (iz + 1)·stride + ix + 1.
   */
  stride: number;
  dx: number;
  dz: number;
  x0: number;
  z0: number;
  /** Source position (m). */
  xs: number;
  zs: number;
  /** Slowness at the source (s/m), the factored U of a node sitting exactly on it. */
  s0: number;
  factored: boolean;
  /** Velocity (m/s) and its gradient (1/s, x and elevation) at the source, for the near-axis reference. */
  vs: number;
  gx: number;
  gz: number;
  second: boolean;
  /** Slowness ratio above which three nodes are not one smooth medium (no second order across). */
  ratio: number;
  /** Whether any cell is a contrast cell (lets the loop skip the edge look-ups). */
  anyContrast: boolean;
  /**
   * Per node, interleaved so one cache line serves a node's three reads: F[3i] = T (travel time,
   * the heap key), F[3i+1] = U (T/r factored, or T plain; set on acceptance; before that, in the
   * factored scheme, the node's distance r to the source), F[3i+2] = slowness.
   */
  F: Float64Array;
  state: Uint8Array;
  cellS: Float64Array;
  cellC: Uint8Array;
  heap: IndexedMinHeap;
  /** Safe minimum of a node whose key is provisional (read only while flagged). */
  safe: Float64Array;
  /** Per column, cos and |sin| of the ground surface's dip (surface.ts), for nodes next to the air. */
  surfaceCos: Float64Array;
  surfaceSin: Float64Array;
  /** Per column, the steepest rise from the source that still sees it through the ground (surface.ts sourceHorizon). */
  horizon: Float64Array;
  /** Optional extra updates after a node's acceptance (surface-links.ts); off when absent. */
  afterAccept?: (p: number) => void;
  /** The exact surface is handled by afterAccept and the start region: skip the mask-based candidates. */
  noStaircase?: boolean;
}

/** Node kinds in the low two bits of `state`. */
export const FAR = 0;
export const TRIAL = 1;
export const DONE = 2;
export const AIR = 3;
export const KIND = 3;
/** Flag: the node's key is a provisional near-axis value (its safe minimum is in `safe`). */
export const PROVISIONAL = 4;
/** Flag: the node has had a causal two-axis candidate. */
const HAS_TWO = 8;
/**
 * Flag, set before the march and kept: a ground node with air above it (the grid's top row counts:
 * with no surface given the ground starts there) or beside it, inside the grid (airNeighbours).
 */
export const NEAR_AIR = 16;

export function march(m: MarchState): void {
  const { nx, nz, stride, dx, dz, x0, z0, xs, zs, s0, factored, second, ratio, anyContrast, F, state, cellS, cellC, heap, safe, vs, gx, gz, surfaceCos, surfaceSin, horizon } = m;
  const noStaircase = m.noStaircase === true;
  const afterAccept = m.afterAccept;
  const nearAxisOn = factored;
  const ncx = nx - 1;
  const invStride = 1 / stride;
  const invDx = 1 / dx;
  const invDz = 1 / dz;

  while (heap.size > 0) {
    const p = heap.pop();
    state[p] = DONE;
    const row = Math.floor((p + 0.5) * invStride); // exact: the +½ keeps float rounding off row ends
    const piz = row - 1;
    const pix = p - row * stride - 1;
    const Tp = F[3 * p];
    if (factored) {
      const r = F[3 * p + 1]; // a trial node keeps its distance to the source in the U slot
      F[3 * p + 1] = r > 0 ? Tp / r : s0;
    } else {
      F[3 * p + 1] = Tp;
    }
    const Up = F[3 * p + 1];
    const sp = F[3 * p + 2];
    if (afterAccept !== undefined) afterAccept(p);

    for (let dir = 0; dir < 4; dir++) {
      const alongX = dir < 2;
      const sgn = (dir & 1) === 0 ? -1 : 1; // q = p + sgn along the axis
      let qix = pix;
      let qiz = piz;
      if (alongX) qix += sgn;
      else qiz += sgn;
      const step = alongX ? sgn : sgn * stride; // index offset p → q (off the grid: a border node, AIR)
      const q = p + step;
      const stq = state[q];
      const kindQ = stq & KIND;
      if (kindQ >= DONE) continue;

      const xq = x0 + qix * dx;
      const zq = z0 - qiz * dz;
      let rq = 1;
      let ex = 0;
      let ez = 0;
      if (factored) {
        const ox = xq - xs;
        const oz = zq - zs;
        const r2 = ox * ox + oz * oz;
        // The distance is worked out on a node's first visit and kept in its U slot until acceptance.
        if (kindQ === FAR) {
          rq = Math.sqrt(r2);
          F[3 * q + 1] = rq;
        } else {
          rq = F[3 * q + 1];
        }
        const inv2 = 1 / r2;
        ex = ox * inv2;
        ez = oz * inv2;
      }
      const sq = F[3 * q + 2];

      // Axis through p: signed spacing q − p (z is elevation, so a deeper q has negative spacing).
      const iP = alongX ? sgn * invDx : -sgn * invDz; // 1 / spacing
      const eP = alongX ? ex : ez;
      let aP = eP + iP;
      let bP = rq * Up * iP;
      if (second) {
        const p2 = p - step;
        if ((state[p2] & KIND) === DONE && F[3 * p2] <= Tp) {
          const s1 = sp;
          const s2 = F[3 * p2 + 2];
          let lo = sq < s1 ? sq : s1;
          let hi = sq < s1 ? s1 : sq;
          if (s2 < lo) lo = s2;
          if (s2 > hi) hi = s2;
          if (hi <= lo * ratio) {
            aP = eP + 1.5 * iP;
            bP = rq * (2 * Up - 0.5 * F[3 * p2 + 1]) * iP;
          }
        }
      }

      // One-axis candidate. Edge slowness: the faster side when a contrast cell borders the edge.
      let sEdge = sq;
      if (anyContrast) {
        if (alongX) {
          const cx = qix < pix ? qix : pix;
          const cUp = qiz > 0 ? (qiz - 1) * ncx + cx : -1;
          const cDn = qiz < nz - 1 ? qiz * ncx + cx : -1;
          if ((cUp >= 0 && cellC[cUp] !== 0) || (cDn >= 0 && cellC[cDn] !== 0)) {
            const a = cUp >= 0 ? cellS[cUp] : Infinity;
            const b = cDn >= 0 ? cellS[cDn] : Infinity;
            sEdge = a < b ? a : b;
          }
        } else {
          const cz = qiz < piz ? qiz : piz;
          const cL = qix > 0 ? cz * ncx + qix - 1 : -1;
          const cR = qix < nx - 1 ? cz * ncx + qix : -1;
          if ((cL >= 0 && cellC[cL] !== 0) || (cR >= 0 && cellC[cR] !== 0)) {
            const a = cL >= 0 ? cellS[cL] : Infinity;
            const b = cR >= 0 ? cellS[cR] : Infinity;
            sEdge = a < b ? a : b;
          }
        }
      }
      // Plain one-axis update (∂T = 0 across): never undershoots; along a refractor edge it is the
      // head wave's own update.
      let best = aP > 0 ? (bP + sEdge) / aP : (bP - sEdge) / aP;
      if (!(best >= Tp)) best = Tp + sEdge * (alongX ? dx : dz);
      // Next to the air the grid's staircase leaves no upwind neighbour across, and the plain
      // update acts as if the wave ran along the grid axis (on sloping ground: late by up to
      // 0.5 ms at 0.5 m nodes). Two surface candidates (surface.ts), each taken only for steps on
      // which a wave arriving more steeply from inside (a diving or head wave) would gain less,
      // so neither undercuts it:
      //  - the node sees the source through the ground: the missing across slope is the reference
      //    time's (the gentler of the bent and the straight one) — exact in uniform ground; steps
      //    along x, and up a step of the staircase on the source's side;
      //  - it does not: the wave has come round the surface and runs along it, gaining the step's
      //    share along the surface's tangent; steps along x where the surface dips under 45°, and
      //    up a step of the staircase.
      if (
        !noStaircase && sEdge === sq &&
        // Air above (the grid's top row counts: with no surface given the ground starts there) or beside, inside the grid.
        (stq & NEAR_AIR) !== 0
      ) {
        const run = Math.abs(xq - xs);
        const rise = zq - zs;
        const stairStep = run > 0 && (state[xs < xq ? q - 1 : q + 1] & KIND) === AIR;
        const sees = run === 0 || rise / run <= horizon[qix];
        let t = Infinity;
        if (sees && factored && (alongX || stairStep)) {
          const bent = referenceLogSlope(xq - xs, rise, gx, gz, vs, alongX);
          const straight = (alongX ? rise : xq - xs) / (rq * rq);
          const kappa = Math.abs(bent) < Math.abs(straight) ? bent : straight;
          const a = aP * aP + kappa * kappa;
          const b = aP * bP;
          const disc = b * b - a * (bP * bP - sq * sq);
          if (disc >= 0) t = (b + Math.sqrt(disc)) / a;
          // A staircase corner can lie nearer the source than its only ground neighbour p (the
          // sliver of ground between them is above the grid): it is reached no later than p.
          if (!(t >= Tp)) t = rq < Math.hypot(x0 + pix * dx - xs, z0 - piz * dz - zs) ? Tp : Infinity;
        } else if (!sees && (alongX ? surfaceCos[qix] >= Math.SQRT1_2 : stairStep)) {
          t = Tp + sq * (alongX ? dx * surfaceCos[qix] : dz * surfaceSin[qix]);
        }
        if (t < best) best = t;
      }
      let two = false;

      // Two-axis candidates: p with each accepted neighbour b of q on the other axis.
      for (let side = -1; side <= 1; side += 2) {
        let bix = qix;
        let biz = qiz;
        if (alongX) biz += side;
        else bix += side;
        const bStep = alongX ? side * stride : side;
        const b = q + bStep;
        if ((state[b] & KIND) !== DONE) continue;
        const Tb = F[3 * b];
        const Ub = F[3 * b + 1];
        const iB = alongX ? side * invDz : -side * invDx;
        const eB = alongX ? ez : ex;
        let aB = eB + iB;
        let bB = rq * Ub * iB;
        if (second) {
          const b2 = b + bStep;
          if ((state[b2] & KIND) === DONE && F[3 * b2] <= Tb) {
            const s1 = F[3 * b + 2];
            const s2 = F[3 * b2 + 2];
            let lo = sq < s1 ? sq : s1;
            let hi = sq < s1 ? s1 : sq;
            if (s2 < lo) lo = s2;
            if (s2 > hi) hi = s2;
            if (hi <= lo * ratio) {
              aB = eB + 1.5 * iB;
              bB = rq * (2 * Ub - 0.5 * F[3 * b2 + 1]) * iB;
            }
          }
        }
        let sc = sq;
        if (anyContrast) {
          const cell = alongX
            ? (side < 0 ? biz : qiz) * ncx + (qix < pix ? qix : pix)
            : (qiz < piz ? qiz : piz) * ncx + (side < 0 ? bix : qix);
          if (cellC[cell] !== 0) sc = cellS[cell];
        }
        const a = aP * aP + aB * aB;
        const bb = aP * bP + aB * bB;
        const c = bP * bP + bB * bB - sc * sc;
        const disc = bb * bb - a * c;
        if (disc < 0) continue;
        const t = (bb + Math.sqrt(disc)) / a;
        if (t >= Tp && t >= Tb) {
          two = true;
          if (t < best) best = t;
        }
      }

      // Provisional near-axis candidate. Beside the line through the source where the slope across
      // it vanishes, a node has no upwind neighbour across that line; its one-axis update then keeps
      // the reference time's own slope across (referenceLogSlope: exact in uniform ground, bent with
      // the rays in a velocity gradient). It holds only while the node has no two-axis candidate,
      // since farther out it could undershoot.
      let tau = Infinity;
      if (nearAxisOn && !two && (stq & HAS_TWO) === 0 && sEdge === sq && nearReferenceAxis(alongX ? zq - zs : xq - xs, alongX ? dz : dx, vs + gx * (xq - xs) + gz * (zq - zs), rq, alongX ? gz : gx)) {
        // Slope of ln T₀ across the axis; small means q sits within about a cell of the reference's
        // own axis (the line where the across slope vanishes), where no upwind neighbour exists.
        const kappa = referenceLogSlope(xq - xs, zq - zs, gx, gz, vs, alongX);
        if (Math.abs(kappa) * rq * rq <= (alongX ? dz : dx)) {
          const a = aP * aP + kappa * kappa;
          const b = aP * bP;
          const c = bP * bP - sq * sq;
          const disc = b * b - a * c;
          if (disc >= 0) {
            const t = (b + Math.sqrt(disc)) / a;
            if (t >= Tp) tau = t;
          }
        }
      }

      // Key = least safe candidate; a provisional one counts while the node has no two-axis
      // candidate. T holds the key; `safe` keeps the safe minimum only while the key is provisional.
      let st2 = stq;
      if (two) st2 |= HAS_TWO;
      let key: number;
      if ((st2 & PROVISIONAL) !== 0) {
        let sf = safe[q];
        if (best < sf) sf = best;
        safe[q] = sf;
        let pv = F[3 * q];
        if (tau < pv) pv = tau;
        if ((st2 & HAS_TWO) !== 0 || pv >= sf) {
          key = sf;
          st2 &= ~PROVISIONAL;
        } else {
          key = pv;
        }
      } else {
        const sf = best < F[3 * q] ? best : F[3 * q];
        if ((st2 & HAS_TWO) === 0 && tau < sf) {
          safe[q] = sf;
          key = tau;
          st2 |= PROVISIONAL;
        } else {
          key = sf;
        }
      }
      if (key !== F[3 * q]) {
        F[3 * q] = key;
        heap.update(q, key);
      }
      state[q] = (st2 & ~KIND) | TRIAL;
    }
  }
}

/**
 * Cheap pre-check for the near-axis candidate, without the logarithm: the reference's across slope
 * vanishes where e_across = r²·G_across/(2v) (v the reference velocity at q, > 0 near the source),
 * so only nodes within a few cells of that line go on to the exact test.
 */
function nearReferenceAxis(oAcross: number, hAcross: number, vq: number, rq: number, gAcross: number): boolean {
  return Math.abs(2 * oAcross * vq - rq * rq * gAcross) <= 6 * hAcross * vq;
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
