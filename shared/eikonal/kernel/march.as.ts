/**
 * The fast-marching loop and its heap, in AssemblyScript: the one implementation of the march,
 * compiled to WebAssembly by `npm run build:kernel` (scripts/build-kernel.ts) and run by the browser,
 * the worker and the command line alike (kernel.ts loads it). Compiled code runs the same
 * arithmetic as plain TypeScript about 1.5× faster here (no bounds checks, no type guards;
 * docs/engine.md), and the march is most of a solve.
 *
 * The arrays live in the module's memory at addresses the host sets once per grid (setLayout).
 * Per solve, fmm.ts puts in the velocities and the ground mask, resets the nodes here
 * (resetNodes), places the start nodes, calls march() and takes the times out (copyTimes). Two helpers stay in JavaScript and are
 * imported, so each has one implementation and the times are the same to the last bit as before:
 * the reference slope near the source (reference.ts, used by the solver's start too) and the
 * surface links (surface-links.ts, geometry on the surface polyline), called per accepted node
 * only when a surface line is given.
 *
 * Each accepted node p updates its four neighbours q with the candidates that involve p:
 * the one-axis update towards p, and the two-axis updates with each accepted neighbour b of q
 * on the other axis (the cell q–p–b). q keeps the least causal candidate (t ≥ T_p, t ≥ T_b).
 * The stencil algebra is that of stencil.ts (factored form, mixed second order; sources there).
 */

// @ts-ignore: decorator
@external('env', 'afterAccept')
declare function afterAccept(p: i32): void;
// @ts-ignore: decorator
@external('env', 'referenceLogSlope')
declare function referenceLogSlope(ex: f64, ez: f64, gx: f64, gz: f64, vs: f64, alongX: bool): f64;
// @ts-ignore: decorator
@external('env', 'hypot')
declare function hypot(a: f64, b: f64): f64;

// Node kinds in the low two bits of the state byte, and flags: the numbers of node-state.ts (documented there).
const FAR: u8 = 0;
const TRIAL: u8 = 1;
const DONE: u8 = 2;
const AIR: u8 = 3;
const KIND: u8 = 3;
const PROVISIONAL: u8 = 4;
const HAS_TWO: u8 = 8;
const NEAR_AIR: u8 = 16;
// Bits of the smooth array (node-state.ts smoothTriples).
const SMOOTH_X: u8 = 1;
const SMOOTH_Z: u8 = 2;

// Layout (setLayout): grid and array addresses. F holds T, U, slowness per node (24 bytes).
let nx: i32 = 0;
let nz: i32 = 0;
let stride: i32 = 0;
let dx: f64 = 0;
let dz: f64 = 0;
let x0: f64 = 0;
let z0: f64 = 0;
let pF: usize = 0;
let pState: usize = 0;
let pVelocity: usize = 0;
let pActive: usize = 0;
let pNearAir: usize = 0;
let pSlowness: usize = 0;
let pTimes: usize = 0;
let pSmooth: usize = 0;
let pSafe: usize = 0;
let pCellS: usize = 0;
let pCellC: usize = 0;
let pCos: usize = 0;
let pSin: usize = 0;
let pHorizon: usize = 0;
let pKeys: usize = 0;
let pNodes: usize = 0;
let pPos: usize = 0;
let heapCount: i32 = 0;

/** Start of free memory after the module's own data: the host places its arrays from here. */
export function dataEnd(): usize {
  return __heap_base;
}

export function setLayout(
  nx_: i32, nz_: i32, dx_: f64, dz_: f64, x0_: f64, z0_: f64,
  f: usize, state: usize, smooth: usize, safe: usize, cellS: usize, cellC: usize, cos: usize, sin: usize, horizon: usize,
  keys: usize, nodes: usize, pos: usize,
  velocity: usize, active: usize, nearAir: usize, slowness: usize, times: usize,
): void {
  nx = nx_;
  nz = nz_;
  stride = nx_ + 2;
  dx = dx_;
  dz = dz_;
  x0 = x0_;
  z0 = z0_;
  pF = f;
  pState = state;
  pSmooth = smooth;
  pSafe = safe;
  pCellS = cellS;
  pCellC = cellC;
  pCos = cos;
  pSin = sin;
  pHorizon = horizon;
  pKeys = keys;
  pNodes = nodes;
  pPos = pos;
  pVelocity = velocity;
  pActive = active;
  pNearAir = nearAir;
  pSlowness = slowness;
  pTimes = times;
}

/**
 * Slowness per node from the velocities, and the march's start state: every ground node FAR (with
 * its NEAR_AIR flag when the mask-based surface candidates are on), air AIR. Returns whether every
 * slowness is what the slowness array already held (the same model as the last solve).
 */
export function resetNodes(withNearAir: bool): bool {
  let same = true;
  let i = 0;
  for (let row = 0; row < nz; row++) {
    // Node (ix, row) sits at b = (row + 1)·(nx + 2) + ix + 1 on the bordered grid.
    let b = (row + 1) * stride + 1;
    for (const end = i + nx; i < end; i++, b++) {
      const on = load<u8>(pActive + <usize>i) != 0;
      const si: f64 = on ? 1 / getF64(pVelocity, i) : Infinity;
      if (getF64(pSlowness, i) != si) {
        store<f64>(pSlowness + (<usize>i << 3), si);
        same = false;
      }
      setT(b, Infinity);
      store<f64>(pF + <usize>b * 24, si, 16);
      setState(b, on ? FAR | (withNearAir ? load<u8>(pNearAir + <usize>b) : 0) : AIR);
    }
  }
  return same;
}

/** The grid's times out of the bordered node arrays, into the times array. */
export function copyTimes(): void {
  let i = 0;
  for (let row = 0; row < nz; row++) {
    let b = (row + 1) * stride + 1;
    for (const end = i + nx; i < end; i++, b++) store<f64>(pTimes + (<usize>i << 3), getT(b));
  }
}

// @ts-ignore: decorator
@inline function getT(i: i32): f64 { return load<f64>(pF + <usize>i * 24); }
// @ts-ignore: decorator
@inline function setT(i: i32, v: f64): void { store<f64>(pF + <usize>i * 24, v); }
// @ts-ignore: decorator
@inline function getU(i: i32): f64 { return load<f64>(pF + <usize>i * 24, 8); }
// @ts-ignore: decorator
@inline function setU(i: i32, v: f64): void { store<f64>(pF + <usize>i * 24, v, 8); }
// @ts-ignore: decorator
@inline function getS(i: i32): f64 { return load<f64>(pF + <usize>i * 24, 16); }
// @ts-ignore: decorator
@inline function getState(i: i32): u8 { return load<u8>(pState + <usize>i); }
// @ts-ignore: decorator
@inline function setState(i: i32, v: u8): void { store<u8>(pState + <usize>i, v); }
// @ts-ignore: decorator
@inline function getF64(base: usize, i: i32): f64 { return load<f64>(base + (<usize>i << 3)); }

// ---- Indexed binary min-heap keyed by travel time, with decrease-key and raise-key ----
// Keys and node ids in parallel arrays, pos[node] = slot or −1 (Sethian 1999, "Level Set Methods and
// Fast Marching Methods", Cambridge Univ. Press, §8.3). One slot more than nodes: pop() parks +∞
// past the last entry, so the smaller child is chosen without testing that the right one exists.

// @ts-ignore: decorator
@inline function key(k: i32): f64 { return load<f64>(pKeys + (<usize>k << 3)); }
// @ts-ignore: decorator
@inline function nodeAt(k: i32): i32 { return load<i32>(pNodes + (<usize>k << 2)); }
// @ts-ignore: decorator
@inline function slotOf(node: i32): i32 { return load<i32>(pPos + (<usize>node << 2)); }
// @ts-ignore: decorator
@inline function place(k: i32, kk: f64, node: i32): void {
  store<f64>(pKeys + (<usize>k << 3), kk);
  store<i32>(pNodes + (<usize>k << 2), node);
  store<i32>(pPos + (<usize>node << 2), k);
}

export function heapSize(): i32 {
  return heapCount;
}

/** Empties the heap (only the nodes still inside need resetting). */
export function heapClear(): void {
  for (let k = 0; k < heapCount; k++) store<i32>(pPos + (<usize>nodeAt(k) << 2), -1);
  heapCount = 0;
}

/** Insert a node, or lower its key when already present (never raises a key). */
export function heapPushOrDecrease(node: i32, kk: f64): void {
  const k = slotOf(node);
  if (k >= 0 && kk >= key(k)) return;
  siftUp(k < 0 ? heapCount++ : k, node, kk);
}

/** Set a node's key up or down (inserting it when absent). */
export function heapUpdate(node: i32, kk: f64): void {
  const k = slotOf(node);
  if (k < 0 || kk <= key(k)) {
    siftUp(k < 0 ? heapCount++ : k, node, kk);
    return;
  }
  // Raise: sift down from slot k.
  const n = heapCount;
  let j = k;
  for (;;) {
    let child = 2 * j + 1;
    if (child >= n) break;
    let ck = key(child);
    const right = child + 1;
    if (right < n && key(right) < ck) {
      child = right;
      ck = key(right);
    }
    if (ck >= kk) break;
    place(j, ck, nodeAt(child));
    j = child;
  }
  place(j, kk, node);
}

function siftUp(k: i32, node: i32, kk: f64): void {
  while (k > 0) {
    const parent = (k - 1) >> 1;
    const pk = key(parent);
    if (pk <= kk) break;
    place(k, pk, nodeAt(parent));
    k = parent;
  }
  place(k, kk, node);
}

/** Remove and return the node with the smallest key (heap must be non-empty). */
export function heapPop(): i32 {
  const top = nodeAt(0);
  store<i32>(pPos + (<usize>top << 2), -1);
  const n = --heapCount;
  if (n == 0) return top;
  const kk = key(n);
  const node = nodeAt(n);
  store<f64>(pKeys + (<usize>n << 3), Infinity); // the sentinel: a right child at n is never the smaller
  let k = 0;
  for (;;) {
    let child = 2 * k + 1;
    if (child >= n) break;
    child += <i32>(key(child + 1) < key(child)); // which side wins is a coin toss: no branch
    const ck = key(child);
    if (ck >= kk) break;
    place(k, ck, nodeAt(child));
    k = child;
  }
  place(k, kk, node);
  return top;
}

// ---- The march ----

/**
 * Runs the march from the nodes already in the heap. Arguments as MarchScheme in kernel.ts:
 * source position and slowness, the reference velocity and gradient at the source, the scheme.
 */
export function march(
  xs: f64, zs: f64, s0: f64, vs: f64, gx: f64, gz: f64,
  factored: bool, second: bool, anyContrast: bool, noStaircase: bool, hasAfter: bool,
): void {
  const ncx = nx - 1;
  const invDx = 1 / dx;
  const invDz = 1 / dz;
  const invStride = 1 / <f64>stride;
  const nearAxisOn = factored;

  while (heapCount > 0) {
    const p = heapPop();
    setState(p, DONE);
    const row = <i32>((<f64>p + 0.5) * invStride); // exact (the +½ keeps rounding off row ends), and cheaper than an integer division
    const piz = row - 1;
    const pix = p - row * stride - 1;
    const Tp = getT(p);
    if (factored) {
      const r = getU(p); // a trial node keeps its distance to the source in the U slot
      setU(p, r > 0 ? Tp / r : s0);
    } else {
      setU(p, Tp);
    }
    const Up = getU(p);
    const smoothP = load<u8>(pSmooth + <usize>p);
    if (hasAfter) afterAccept(p);

    for (let dir = 0; dir < 4; dir++) {
      const alongX = dir < 2;
      const sgn: i32 = (dir & 1) == 0 ? -1 : 1; // q = p + sgn along the axis
      let qix = pix;
      let qiz = piz;
      if (alongX) qix += sgn;
      else qiz += sgn;
      const step = alongX ? sgn : sgn * stride; // index offset p → q (off the grid: a border node, AIR)
      const q = p + step;
      const stq = getState(q);
      const kindQ = stq & KIND;
      if (kindQ >= DONE) continue;

      const xq = x0 + <f64>qix * dx;
      const zq = z0 - <f64>qiz * dz;
      let rq: f64 = 1;
      let ex: f64 = 0;
      let ez: f64 = 0;
      if (factored) {
        const ox = xq - xs;
        const oz = zq - zs;
        const r2 = ox * ox + oz * oz;
        // The distance is worked out on a node's first visit and kept in its U slot until acceptance.
        if (kindQ == FAR) {
          rq = Math.sqrt(r2);
          setU(q, rq);
        } else {
          rq = getU(q);
        }
        const inv2 = 1 / r2;
        ex = ox * inv2;
        ez = oz * inv2;
      }
      const sq = getS(q);

      // Axis through p: signed spacing q − p (z is elevation, so a deeper q has negative spacing).
      const iP: f64 = alongX ? <f64>sgn * invDx : <f64>-sgn * invDz; // 1 / spacing
      const eP = alongX ? ex : ez;
      let aP = eP + iP;
      let bP = rq * Up * iP;
      // Second order where the node beyond p is accepted, earlier, and q, p and it are one smooth medium.
      if (second && (smoothP & (alongX ? SMOOTH_X : SMOOTH_Z)) != 0) {
        const p2 = p - step;
        if ((getState(p2) & KIND) == DONE && getT(p2) <= Tp) {
          aP = eP + 1.5 * iP;
          bP = rq * (2 * Up - 0.5 * getU(p2)) * iP;
        }
      }

      // One-axis candidate. Edge slowness: the faster side when a contrast cell borders the edge.
      let sEdge = sq;
      if (anyContrast) {
        if (alongX) {
          const cx = qix < pix ? qix : pix;
          const cUp = qiz > 0 ? (qiz - 1) * ncx + cx : -1;
          const cDn = qiz < nz - 1 ? qiz * ncx + cx : -1;
          if ((cUp >= 0 && load<u8>(pCellC + <usize>cUp) != 0) || (cDn >= 0 && load<u8>(pCellC + <usize>cDn) != 0)) {
            const a = cUp >= 0 ? getF64(pCellS, cUp) : Infinity;
            const b = cDn >= 0 ? getF64(pCellS, cDn) : Infinity;
            sEdge = a < b ? a : b;
          }
        } else {
          const cz = qiz < piz ? qiz : piz;
          const cL = qix > 0 ? cz * ncx + qix - 1 : -1;
          const cR = qix < nx - 1 ? cz * ncx + qix : -1;
          if ((cL >= 0 && load<u8>(pCellC + <usize>cL) != 0) || (cR >= 0 && load<u8>(pCellC + <usize>cR) != 0)) {
            const a = cL >= 0 ? getF64(pCellS, cL) : Infinity;
            const b = cR >= 0 ? getF64(pCellS, cR) : Infinity;
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
      if (!noStaircase && sEdge == sq && (stq & NEAR_AIR) != 0) {
        const run = Math.abs(xq - xs);
        const rise = zq - zs;
        const stairStep = run > 0 && (getState(xs < xq ? q - 1 : q + 1) & KIND) == AIR;
        const sees = run == 0 || rise / run <= getF64(pHorizon, qix);
        let t: f64 = Infinity;
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
          if (!(t >= Tp)) t = rq < hypot(x0 + <f64>pix * dx - xs, z0 - <f64>piz * dz - zs) ? Tp : Infinity;
        } else if (!sees && (alongX ? getF64(pCos, qix) >= Math.SQRT1_2 : stairStep)) {
          t = Tp + sq * (alongX ? dx * getF64(pCos, qix) : dz * getF64(pSin, qix));
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
        if ((getState(b) & KIND) != DONE) continue;
        const Tb = getT(b);
        const Ub = getU(b);
        const iB: f64 = alongX ? <f64>side * invDz : <f64>-side * invDx;
        const eB = alongX ? ez : ex;
        let aB = eB + iB;
        let bB = rq * Ub * iB;
        if (second && (load<u8>(pSmooth + <usize>b) & (alongX ? SMOOTH_Z : SMOOTH_X)) != 0) {
          const b2 = b + bStep;
          if ((getState(b2) & KIND) == DONE && getT(b2) <= Tb) {
            aB = eB + 1.5 * iB;
            bB = rq * (2 * Ub - 0.5 * getU(b2)) * iB;
          }
        }
        let sc = sq;
        if (anyContrast) {
          const cell = alongX
            ? (side < 0 ? biz : qiz) * ncx + (qix < pix ? qix : pix)
            : (qiz < piz ? qiz : piz) * ncx + (side < 0 ? bix : qix);
          if (load<u8>(pCellC + <usize>cell) != 0) sc = getF64(pCellS, cell);
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
      let tau: f64 = Infinity;
      if (nearAxisOn && !two && (stq & HAS_TWO) == 0 && sEdge == sq && nearReferenceAxis(alongX ? zq - zs : xq - xs, alongX ? dz : dx, vs + gx * (xq - xs) + gz * (zq - zs), rq, alongX ? gz : gx)) {
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
      let kk: f64;
      const Tq = getT(q);
      if ((st2 & PROVISIONAL) != 0) {
        let sf = getF64(pSafe, q);
        if (best < sf) sf = best;
        store<f64>(pSafe + (<usize>q << 3), sf);
        let pv = Tq;
        if (tau < pv) pv = tau;
        if ((st2 & HAS_TWO) != 0 || pv >= sf) {
          kk = sf;
          st2 &= ~PROVISIONAL;
        } else {
          kk = pv;
        }
      } else {
        const sf = best < Tq ? best : Tq;
        if ((st2 & HAS_TWO) == 0 && tau < sf) {
          store<f64>(pSafe + (<usize>q << 3), sf);
          kk = tau;
          st2 |= PROVISIONAL;
        } else {
          kk = sf;
        }
      }
      if (kk != Tq) {
        setT(q, kk);
        heapUpdate(q, kk);
      }
      setState(q, (st2 & ~KIND) | TRIAL);
    }
  }
}

/**
 * Cheap pre-check for the near-axis candidate, without the logarithm: the reference's across slope
 * vanishes where e_across = r²·G_across/(2v), so only nodes within a few cells of that line go on.
 */
// @ts-ignore: decorator
@inline function nearReferenceAxis(oAcross: f64, hAcross: f64, vq: f64, rq: f64, gAcross: f64): bool {
  return Math.abs(2 * oAcross * vq - rq * rq * gAcross) <= 6 * hAcross * vq;
}
