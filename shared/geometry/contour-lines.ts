/**
 * Contour lines of a gridded field (travel times, velocities) as joined polylines, by marching squares
 * (Lorensen & Cline 1987, "Marching cubes", SIGGRAPH, reduced to 2-D): every cell whose corners
 * straddle the level gets a segment between two crossed edges (a saddle gets two, split by the
 * mean of the corners), crossings placed by linear interpolation along the edge. Segments meet on
 * shared edges, so chaining them by edge identity gives whole lines without rounding trouble:
 * one path per line keeps the PDF light. Cells with a NaN corner (air) are skipped, so lines end
 * at the ground surface.
 */
import type { Grid } from '../grid';

/** One contour line: x, z pairs in model coordinates (m). */
export type Polyline = number[];

export function contourLines(values: ArrayLike<number>, grid: Grid, level: number): Polyline[] {
  const { nx, nz } = grid;
  // Edge ids: horizontal edge right of node i → 2i, vertical edge below node i → 2i + 1.
  const H = (ix: number, iz: number) => 2 * (iz * nx + ix);
  const V = (ix: number, iz: number) => 2 * (iz * nx + ix) + 1;
  const ends: number[] = []; // edge pairs, one per segment
  for (let iz = 0; iz + 1 < nz; iz++) {
    for (let ix = 0; ix + 1 < nx; ix++) {
      const a = values[iz * nx + ix];
      const b = values[iz * nx + ix + 1];
      const c = values[(iz + 1) * nx + ix + 1];
      const d = values[(iz + 1) * nx + ix];
      if (!(Number.isFinite(a) && Number.isFinite(b) && Number.isFinite(c) && Number.isFinite(d))) continue;
      const index = (a >= level ? 8 : 0) | (b >= level ? 4 : 0) | (c >= level ? 2 : 0) | (d >= level ? 1 : 0);
      if (index === 0 || index === 15) continue;
      const top = H(ix, iz);
      const bottom = H(ix, iz + 1);
      const left = V(ix, iz);
      const right = V(ix + 1, iz);
      const centreAbove = (a + b + c + d) / 4 >= level;
      switch (index) {
        case 1: case 14: ends.push(left, bottom); break;
        case 2: case 13: ends.push(bottom, right); break;
        case 3: case 12: ends.push(left, right); break;
        case 4: case 11: ends.push(top, right); break;
        case 6: case 9: ends.push(top, bottom); break;
        case 7: case 8: ends.push(top, left); break;
        case 5: // b and d above the level
          if (centreAbove) ends.push(top, left, bottom, right);
          else ends.push(top, right, left, bottom);
          break;
        case 10: // a and c above the level
          if (centreAbove) ends.push(top, right, left, bottom);
          else ends.push(top, left, bottom, right);
          break;
      }
    }
  }
  return chain(ends).map((edges) => edges.flatMap((e) => crossing(values, grid, level, e)));
}

/** Where the level crosses an edge, in model coordinates. */
function crossing(values: ArrayLike<number>, grid: Grid, level: number, edge: number): [number, number] {
  const { nx, x0, dx, z0, dz } = grid;
  const node = edge >> 1;
  const ix = node % nx;
  const iz = (node - ix) / nx;
  const p = values[node];
  const q = edge & 1 ? values[node + nx] : values[node + 1];
  const f = q === p ? 0.5 : (level - p) / (q - p);
  return edge & 1 ? [x0 + ix * dx, z0 - (iz + f) * dz] : [x0 + (ix + f) * dx, z0 - iz * dz];
}

/** Joins segments (pairs of edge ids) that share an edge into runs of edges. */
function chain(ends: number[]): number[][] {
  const count = ends.length / 2;
  // Each edge belongs to at most two segments (the cells on either side).
  const first = new Map<number, number>();
  const second = new Map<number, number>();
  for (let s = 0; s < count; s++) {
    for (const e of [ends[2 * s], ends[2 * s + 1]]) {
      if (first.has(e)) second.set(e, s);
      else first.set(e, s);
    }
  }
  const used = new Uint8Array(count);
  const other = (e: number, s: number): number | undefined => {
    const f = first.get(e);
    return f === s ? second.get(e) : f;
  };
  // Walks from edge `from` through segment s onwards, appending edges, until the line ends or closes.
  const walk = (s: number, from: number, out: number[]) => {
    let seg: number | undefined = s;
    let edge = from;
    while (seg !== undefined && !used[seg]) {
      used[seg] = 1;
      const next: number = ends[2 * seg] === edge ? ends[2 * seg + 1] : ends[2 * seg];
      out.push(next);
      edge = next;
      seg = other(edge, seg);
    }
  };
  const lines: number[][] = [];
  for (let s = 0; s < count; s++) {
    if (used[s]) continue;
    const forward: number[] = [ends[2 * s]];
    walk(s, ends[2 * s], forward);
    // Extend backwards from the start edge through the neighbouring segment, if any.
    const backward: number[] = [];
    const before = other(ends[2 * s], s);
    if (before !== undefined && !used[before]) walk(before, ends[2 * s], backward);
    lines.push([...backward.reverse(), ...forward]);
  }
  return lines;
}
