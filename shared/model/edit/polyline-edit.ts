/**
 * Editing an interface polyline ([x, z] points, x strictly increasing, FORMATS.md §1) node by
 * node. The end nodes carry the coverage of the grid, so they keep their x; every change
 * returns a new array (the same array when nothing changed, so callers can skip a history step).
 */
import type { Grid } from '../../grid';
import { evalPolyline } from '../polyline';

export type Point = [number, number];

/** Nodes closer than this (m) in x would make "x strictly increasing" fragile after rounding. */
export const MIN_NODE_GAP = 0.01;

const gridBottom = (g: Grid): number => g.z0 - (g.nz - 1) * g.dz;
const gridRight = (g: Grid): number => g.x0 + (g.nx - 1) * g.dx;
const clamp = (v: number, lo: number, hi: number): number => Math.min(hi, Math.max(lo, v));

/** Move node i to (x, z): x stays between its neighbours (end nodes keep theirs), z stays inside the grid when one is given. */
export function moveNode(points: readonly Point[], i: number, x: number, z: number, grid?: Grid): Point[] {
  if (i < 0 || i >= points.length || !Number.isFinite(x) || !Number.isFinite(z)) return points as Point[];
  const last = points.length - 1;
  let nx = points[i][0];
  if (i > 0 && i < last) nx = clamp(x, points[i - 1][0] + MIN_NODE_GAP, points[i + 1][0] - MIN_NODE_GAP);
  const nz = grid ? clamp(z, gridBottom(grid), grid.z0) : z;
  if (nx === points[i][0] && nz === points[i][1]) return points as Point[];
  const out = points.map((p) => [p[0], p[1]] as Point);
  out[i] = [nx, nz];
  return out;
}

/** Insert a node at x (z on the line unless given) when x lies strictly between the end nodes and clear of the others. */
export function insertNode(points: readonly Point[], x: number, z?: number): Point[] {
  const n = points.length;
  if (n < 2 || !Number.isFinite(x) || !(x > points[0][0] + MIN_NODE_GAP) || !(x < points[n - 1][0] - MIN_NODE_GAP)) return points as Point[];
  let at = 1;
  while (at < n && points[at][0] < x) at++;
  if (points[at][0] - x < MIN_NODE_GAP || x - points[at - 1][0] < MIN_NODE_GAP) return points as Point[];
  const zNew = z !== undefined && Number.isFinite(z) ? z : evalPolyline(points, x);
  const out = points.map((p) => [p[0], p[1]] as Point);
  out.splice(at, 0, [x, zNew]);
  return out;
}

/** Insert a node halfway along the widest segment (the table's "add node"). */
export function insertNodeInWidestGap(points: readonly Point[]): Point[] {
  let best = -1;
  let width = 0;
  for (let i = 1; i < points.length; i++) {
    const w = points[i][0] - points[i - 1][0];
    if (w > width) {
      width = w;
      best = i;
    }
  }
  if (best < 0) return points as Point[];
  return insertNode(points, (points[best - 1][0] + points[best][0]) / 2);
}

/** Delete an inner node; the end nodes and the last two nodes cannot go. */
export function deleteNode(points: readonly Point[], i: number): Point[] {
  if (points.length <= 2 || i <= 0 || i >= points.length - 1) return points as Point[];
  return points.filter((_, k) => k !== i).map((p) => [p[0], p[1]] as Point);
}

export const canDeleteNode = (points: readonly Point[], i: number): boolean => points.length > 2 && i > 0 && i < points.length - 1;

/** The polyline restricted to [xStart, xEnd], with end nodes exactly there (values held beyond the old ends). */
export function fitPolylineToRange(points: readonly Point[], xStart: number, xEnd: number): Point[] {
  const inner = points.filter(([x]) => x > xStart + MIN_NODE_GAP && x < xEnd - MIN_NODE_GAP).map((p) => [p[0], p[1]] as Point);
  return [[xStart, evalPolyline(points, xStart)], ...inner, [xEnd, evalPolyline(points, xEnd)]];
}

/** Halfway between two polylines, at every node x of either (within [xStart, xEnd]). */
export function midline(a: readonly Point[], b: readonly Point[], xStart: number, xEnd: number): Point[] {
  const xs = [...new Set([xStart, xEnd, ...a.map((p) => p[0]), ...b.map((p) => p[0])])]
    .filter((x) => x >= xStart && x <= xEnd)
    .sort((p, q) => p - q);
  const out: Point[] = [];
  for (const x of xs) {
    if (out.length && x - out[out.length - 1][0] < MIN_NODE_GAP) continue;
    out.push([x, (evalPolyline(a, x) + evalPolyline(b, x)) / 2]);
  }
  return out;
}

export { gridBottom, gridRight };
