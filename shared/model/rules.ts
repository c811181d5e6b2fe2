/**
 * Rule checks for a model file that has already passed the structural schema
 * (shared/schemas/model.ts). Each problem is reported with the JSON path of the value at
 * fault, e.g. `layers[1].base[3]` / "x must increase".
 */
import { MAX_GRID_NODES, outOfRange, X_RANGE, Z_RANGE } from '../limits';

export interface ModelIssue {
  /** JSON path segments, e.g. ['layers', 1, 'base', 3]. */
  path: (string | number)[];
  message: string;
}

type Pt = [number, number];
/** Just the fields the rules read; kept structural so this file does not import the schema. */
interface CheckedModel {
  grid: { x0: number; dx: number; nx: number; z0: number; dz: number; nz: number };
  surface?: Pt[];
  velocity?: unknown[];
  layers?: { base?: Pt[] }[];
  edits?: { ix: number; iz: number }[];
}

const fmt = (n: number): string => n.toLocaleString('en-US');

export function checkModelRules(model: CheckedModel): ModelIssue[] {
  const issues: ModelIssue[] = [];
  const { grid } = model;
  const nodes = grid.nx * grid.nz;
  if (nodes > MAX_GRID_NODES) {
    issues.push({
      path: ['grid'],
      message: `grid has ${fmt(nodes)} nodes (nx × nz = ${grid.nx} × ${grid.nz}); the limit is ${fmt(MAX_GRID_NODES)}`,
    });
  }

  // Grid extent: the far corner is a position and an elevation too (x0 and z0 are checked by the schema).
  const xEnd = grid.x0 + (grid.nx - 1) * grid.dx;
  const zBottom = grid.z0 - (grid.nz - 1) * grid.dz;
  const xProblem = outOfRange(xEnd, X_RANGE);
  if (xProblem) issues.push({ path: ['grid'], message: `the grid's right edge x0 + (nx − 1)·dx ${xProblem}` });
  const zProblem = outOfRange(zBottom, Z_RANGE);
  if (zProblem) issues.push({ path: ['grid'], message: `the grid's bottom z0 − (nz − 1)·dz ${zProblem}` });

  const hasVelocity = model.velocity !== undefined;
  const hasLayers = model.layers !== undefined;
  if (hasVelocity && hasLayers) issues.push({ path: [], message: 'give either "velocity" or "layers", not both' });
  if (!hasVelocity && !hasLayers) issues.push({ path: [], message: 'a model needs either "velocity" (a raw grid) or "layers"' });

  if (model.velocity && model.velocity.length !== nodes) {
    issues.push({
      path: ['velocity'],
      message: `has ${fmt(model.velocity.length)} values; the grid needs nx × nz = ${grid.nx} × ${grid.nz} = ${fmt(nodes)}`,
    });
  }

  if (model.surface) {
    checkPolyline(model.surface, ['surface'], grid, issues);
    checkSurfaceInsideGrid(model.surface, grid, issues);
  }

  const layers = model.layers ?? [];
  layers.forEach((layer, k) => {
    const last = k === layers.length - 1;
    if (!last && !layer.base) {
      issues.push({ path: ['layers', k, 'base'], message: 'required: every layer except the last needs a base' });
    }
    if (last && layer.base) {
      issues.push({ path: ['layers', k, 'base'], message: 'the last layer reaches the grid bottom and takes no base' });
    }
    if (layer.base) checkPolyline(layer.base, ['layers', k, 'base'], grid, issues);
  });

  model.edits?.forEach((edit, i) => {
    if (edit.ix >= grid.nx) issues.push({ path: ['edits', i, 'ix'], message: `ix = ${edit.ix} is outside the grid (nx = ${grid.nx})` });
    if (edit.iz >= grid.nz) issues.push({ path: ['edits', i, 'iz'], message: `iz = ${edit.iz} is outside the grid (nz = ${grid.nz})` });
  });
  return issues;
}

/** x strictly increasing, and the polyline spans the grid's whole x range (so it never needs extrapolating). */
function checkPolyline(points: Pt[], path: (string | number)[], grid: CheckedModel['grid'], issues: ModelIssue[]): void {
  for (let i = 1; i < points.length; i++) {
    if (!(points[i][0] > points[i - 1][0])) {
      issues.push({ path: [...path, i], message: `x must increase (x = ${points[i][0]} follows x = ${points[i - 1][0]})` });
    }
  }
  const eps = 1e-6 * grid.dx;
  const xEnd = grid.x0 + (grid.nx - 1) * grid.dx;
  const first = points[0][0];
  const last = points[points.length - 1][0];
  if (first > grid.x0 + eps) {
    issues.push({ path: [...path, 0], message: `starts at x = ${first}, after the grid's left edge x = ${grid.x0}; it must cover the grid` });
  }
  if (last < xEnd - eps) {
    issues.push({
      path: [...path, points.length - 1],
      message: `ends at x = ${last}, before the grid's right edge x = ${xEnd}; it must cover the grid`,
    });
  }
}

/** The ground surface must lie between the grid's top and bottom rows, or some column would be all air or cut off. */
function checkSurfaceInsideGrid(points: Pt[], grid: CheckedModel['grid'], issues: ModelIssue[]): void {
  const eps = 1e-6 * grid.dz;
  const zBottom = grid.z0 - (grid.nz - 1) * grid.dz;
  points.forEach(([, z], i) => {
    if (z > grid.z0 + eps) issues.push({ path: ['surface', i], message: `z = ${z} is above the grid top (z0 = ${grid.z0})` });
    if (z < zBottom + grid.dz - eps) {
      issues.push({ path: ['surface', i], message: `z = ${z} leaves less than one cell of ground above the grid bottom (z = ${zBottom})` });
    }
  });
}

/** JSON path segments → `layers[1].base[3]`; the file itself is `(root)`. */
export function formatJsonPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const seg of path) {
    if (typeof seg === 'number') out += `[${seg}]`;
    else out += out === '' ? String(seg) : `.${String(seg)}`;
  }
  return out === '' ? '(root)' : out;
}
