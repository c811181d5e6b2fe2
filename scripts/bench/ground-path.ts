/**
 * Exact first-arrival times in uniform ground under a polygonal surface: the shortest path from
 * source to receiver that stays in the ground (z ≤ surface), divided by the velocity. Computed
 * independently of the solver, as a visibility-graph shortest path: in a polygonal domain a
 * shortest path is a chain of straight segments bending only at reflex vertices of the boundary
 * (here: surface vertices where the slope increases, valley-like bends), so Dijkstra over those
 * vertices with straight visible links is exact for the polyline (from memory: Lee & Preparata
 * 1984, "Euclidean shortest paths in the presence of rectilinear barriers", Networks 14; de Berg
 * et al., "Computational Geometry", ch. 15). A smooth surface is given as a fine polyline, which
 * is then the model surface itself, so the answer is exact for the model the solver is given.
 */
import type { Point } from '../../shared/eikonal';

const EPS = 1e-9; // m: a segment touching the surface counts as in the ground

/** Surface polyline, x strictly increasing. */
export type Surface = readonly Point[];

function surfaceAt(s: Surface, x: number): number {
  let lo = 0;
  let hi = s.length - 1;
  if (x <= s[0].x) return s[0].z;
  if (x >= s[hi].x) return s[hi].z;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (s[mid].x <= x) lo = mid;
    else hi = mid;
  }
  const u = (x - s[lo].x) / (s[hi].x - s[lo].x);
  return s[lo].z + u * (s[hi].z - s[lo].z);
}

/**
 * The straight segment a–b stays in the ground. Surface minus segment is piecewise linear with
 * breaks at the surface vertices, so checking the vertices strictly between a and b (and the
 * ends) is exact.
 */
export function visible(s: Surface, a: Point, b: Point): boolean {
  if (a.z > surfaceAt(s, a.x) + EPS || b.z > surfaceAt(s, b.x) + EPS) return false;
  const [l, r] = a.x <= b.x ? [a, b] : [b, a];
  for (const v of s) {
    if (v.x <= l.x || v.x >= r.x) continue;
    const zSeg = l.z + ((v.x - l.x) / (r.x - l.x)) * (r.z - l.z);
    if (zSeg > v.z + EPS) return false;
  }
  return true;
}

/** Interior vertices where the surface turns upward (slope increases): the only bends a path can use. */
function reflexVertices(s: Surface): Point[] {
  const out: Point[] = [];
  for (let i = 1; i < s.length - 1; i++) {
    const left = (s[i].z - s[i - 1].z) / (s[i].x - s[i - 1].x);
    const right = (s[i + 1].z - s[i].z) / (s[i + 1].x - s[i].x);
    if (right > left + 1e-12) out.push(s[i]);
  }
  return out;
}

/**
 * Shortest in-ground path lengths (m) from `source` to each receiver. Dijkstra once from the
 * source over the reflex vertices, then each receiver takes the best visible vertex (or the
 * source directly).
 */
export function groundPathLengths(s: Surface, source: Point, receivers: readonly Point[]): number[] {
  const nodes = [source, ...reflexVertices(s)];
  const dist = new Array<number>(nodes.length).fill(Infinity);
  const done = new Array<boolean>(nodes.length).fill(false);
  dist[0] = 0;
  for (;;) {
    let k = -1;
    for (let i = 0; i < nodes.length; i++) if (!done[i] && dist[i] < Infinity && (k < 0 || dist[i] < dist[k])) k = i;
    if (k < 0) break;
    done[k] = true;
    for (let j = 0; j < nodes.length; j++) {
      if (done[j]) continue;
      const d = dist[k] + Math.hypot(nodes[j].x - nodes[k].x, nodes[j].z - nodes[k].z);
      if (d < dist[j] && visible(s, nodes[k], nodes[j])) dist[j] = d;
    }
  }
  return receivers.map((r) => {
    let best = Infinity;
    for (let i = 0; i < nodes.length; i++) {
      if (!(dist[i] < Infinity)) continue;
      const d = dist[i] + Math.hypot(r.x - nodes[i].x, r.z - nodes[i].z);
      if (d < best && visible(s, nodes[i], r)) best = d;
    }
    return best;
  });
}
