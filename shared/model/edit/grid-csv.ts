/**
 * A plain CSV of the rasterised grid, one node per row: `x,z,v` (m, m elevation, m/s), top row
 * first, x increasing within a row. Air nodes (above the ground surface) have an empty v.
 *
 * Reading it back gives a raw-velocity model (FORMATS.md §1) whose ground surface runs through
 * the topmost ground node of each column, so the ground mask and every velocity come back
 * exactly. Errors name the file line and the column, like the pick-file reader.
 */
import { MAX_GRID_NODES } from '../../limits';
import type { Grid } from '../../grid';
import { MODEL_FORMAT, type ModelFile } from '../../schemas/model';
import { parseModelFile } from '../parse';
import type { Point } from './polyline-edit';
import { notTextMessage } from '../../files/not-text';

export interface GridCsvError {
  /** 1-based file line, null for whole-file problems. */
  line: number | null;
  column: 'x' | 'z' | 'v' | null;
  message: string;
}

export type GridCsvResult = { ok: true; model: ModelFile } | { ok: false; errors: GridCsvError[] };

export const GRID_CSV_HEADER = 'x,z,v';
const MAX_ERRORS = 20;

/** Shortest decimal that reads back as the same Float32 value. */
export function float32Text(v: number): string {
  for (let p = 1; p <= 9; p++) {
    const s = v.toPrecision(p);
    if (Math.fround(Number(s)) === v) return String(Number(s));
  }
  return String(v);
}
const metres = (v: number): string => String(+v.toFixed(6));

/** The grid as CSV text. `velocity` is the rasterised Float32 grid, `active` its ground mask. */
export function formatGridCsv(grid: Grid, velocity: Float32Array, active: Uint8Array): string {
  const { x0, dx, nx, z0, dz, nz } = grid;
  const rows: string[] = [GRID_CSV_HEADER];
  const xs = Array.from({ length: nx }, (_, ix) => metres(x0 + ix * dx));
  for (let iz = 0; iz < nz; iz++) {
    const z = metres(z0 - iz * dz);
    for (let ix = 0; ix < nx; ix++) {
      const i = iz * nx + ix;
      rows.push(`${xs[ix]},${z},${active[i] ? float32Text(velocity[i]) : ''}`);
    }
  }
  return `${rows.join('\n')}\n`;
}

interface Row {
  line: number;
  x: number;
  z: number;
  /** NaN = air */
  v: number;
}

export function parseGridCsv(text: string): GridCsvResult {
  const notText = notTextMessage(text, 'a velocity grid (CSV text)');
  if (notText) return { ok: false, errors: [{ line: 1, column: null, message: notText }] };
  const errors: GridCsvError[] = [];
  const fail = (line: number | null, column: GridCsvError['column'], message: string): void => {
    if (errors.length < MAX_ERRORS) errors.push({ line, column, message });
  };
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  let header: number[] | null = null;
  const rows: Row[] = [];
  for (let k = 0; k < lines.length && errors.length < MAX_ERRORS; k++) {
    const raw = lines[k].trim();
    if (raw === '' || raw.startsWith('#')) continue;
    const cells = raw.split(',').map((c) => c.trim());
    if (!header) {
      const names = cells.map((c) => c.toLowerCase());
      const at = (['x', 'z', 'v'] as const).map((n) => names.indexOf(n));
      if (at.some((i) => i < 0)) {
        fail(k + 1, null, `the header must name the columns x, z and v (found: ${cells.join(', ')})`);
        return { ok: false, errors };
      }
      header = at;
      continue;
    }
    const [x, z, v] = header.map((i) => cells[i] ?? '');
    const row: Row = { line: k + 1, x: Number(x), z: Number(z), v: v === '' ? Number.NaN : Number(v) };
    if (x === '' || !Number.isFinite(row.x)) fail(k + 1, 'x', `"${x}" is not a number (m)`);
    else if (z === '' || !Number.isFinite(row.z)) fail(k + 1, 'z', `"${z}" is not a number (m)`);
    else if (v !== '' && !(Number.isFinite(row.v) && row.v > 0)) fail(k + 1, 'v', `"${v}" is not a velocity > 0 (m/s); leave it empty for air`);
    else rows.push(row);
  }
  if (!header) return { ok: false, errors: [{ line: null, column: null, message: 'the file is empty: expected a header x,z,v and one row per grid node' }] };
  if (errors.length) return { ok: false, errors };

  const xAxis = evenAxis(rows, 'x', fail);
  const zAxis = evenAxis(rows, 'z', fail);
  if (!xAxis || !zAxis) return { ok: false, errors };
  const nx = xAxis.values.length;
  const nz = zAxis.values.length;
  if (nx * nz > MAX_GRID_NODES) {
    fail(null, null, `grid has ${(nx * nz).toLocaleString('en-US')} nodes (${nx} × ${nz}); the limit is ${MAX_GRID_NODES.toLocaleString('en-US')}`);
    return { ok: false, errors };
  }
  const grid: Grid = { x0: xAxis.values[0], dx: xAxis.step, nx, z0: zAxis.values[nz - 1], dz: zAxis.step, nz };
  const velocity = new Float64Array(nx * nz).fill(Number.NaN);
  const lineOf = new Int32Array(nx * nz);
  for (const r of rows) {
    const ix = xAxis.index.get(key(r.x))!;
    const iz = nz - 1 - zAxis.index.get(key(r.z))!;
    const i = iz * nx + ix;
    if (lineOf[i]) fail(r.line, 'x', `node x ${r.x} m, z ${r.z} m is already on line ${lineOf[i]}`);
    else {
      lineOf[i] = r.line;
      velocity[i] = r.v;
    }
  }
  for (let i = 0; i < nx * nz && errors.length < MAX_ERRORS; i++) {
    if (!lineOf[i]) fail(null, null, `no row for the node at x ${metres(grid.x0 + (i % nx) * grid.dx)} m, z ${metres(grid.z0 - Math.floor(i / nx) * grid.dz)} m`);
  }
  if (errors.length) return { ok: false, errors };

  // Ground runs from each column's topmost velocity down to the bottom; air only above it.
  const surface: Point[] = [];
  let anyAir = false;
  for (let ix = 0; ix < nx; ix++) {
    let top = 0;
    while (top < nz && Number.isNaN(velocity[top * nx + ix])) top++;
    if (top === nz) {
      fail(null, 'v', `the column at x ${metres(grid.x0 + ix * grid.dx)} m is all air`);
      continue;
    }
    for (let iz = top + 1; iz < nz; iz++) {
      const i = iz * nx + ix;
      if (Number.isNaN(velocity[i])) fail(lineOf[i], 'v', `air below ground at x ${metres(grid.x0 + ix * grid.dx)} m: ground must reach the grid bottom`);
    }
    if (top > 0) anyAir = true;
    const v = velocity[top * nx + ix];
    for (let iz = 0; iz < top; iz++) velocity[iz * nx + ix] = v; // air copies the ground below it, as the rasteriser does
    surface.push([grid.x0 + ix * grid.dx, grid.z0 - top * grid.dz]);
  }
  if (errors.length) return { ok: false, errors };

  const parsed = parseModelFile({ format: MODEL_FORMAT, grid, ...(anyAir ? { surface } : {}), velocity: Array.from(velocity) });
  if (!parsed.ok) return { ok: false, errors: parsed.issues.map((i) => ({ line: null, column: null, message: `${i.path}: ${i.message}` })) };
  return { ok: true, model: parsed.model };
}

/** Positions are compared to the micrometre, which the writer's six decimals keep. */
const key = (v: number): number => Math.round(v * 1e6);

function evenAxis(rows: readonly Row[], axis: 'x' | 'z', fail: (line: number | null, column: 'x' | 'z', message: string) => void) {
  const first = new Map<number, Row>();
  for (const r of rows) if (!first.has(key(r[axis]))) first.set(key(r[axis]), r);
  const values = [...first.keys()].sort((a, b) => a - b).map((k) => first.get(k)![axis]);
  if (values.length < 2) {
    fail(null, axis, `needs at least two different ${axis} values (found ${values.length})`);
    return null;
  }
  const step = (values[values.length - 1] - values[0]) / (values.length - 1);
  const tol = 1e-6 * Math.max(1, Math.abs(step));
  for (let i = 0; i < values.length; i++) {
    if (Math.abs(values[i] - (values[0] + i * step)) > tol) {
      fail(first.get(key(values[i]))!.line, axis, `${axis} = ${values[i]} m breaks the even spacing of ${axis} (${+step.toFixed(6)} m from ${values[0]} m)`);
      return null;
    }
  }
  const index = new Map<number, number>();
  values.forEach((v, i) => index.set(key(v), i));
  return { values, step, index };
}
