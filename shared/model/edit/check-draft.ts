/**
 * The checks a draft model passes before it may be saved, run in the browser with the same code
 * the API runs (parseModelFile: schema and rules), plus the editor's own rule that interface
 * nodes lie inside the grid, and the plain-words warnings of summariseRaster (velocities outside
 * 100–7000 m/s, common practice, no source). Errors block saving; warnings do not.
 */
import type { Grid } from '../../grid';
import { MAX_GRID_NODES } from '../../limits';
import { parseModelFile, type ModelPathIssue } from '../parse';
import { rasteriseModel, type RasterModel } from '../rasterise';
import { formatJsonPath } from '../rules';
import { summariseRaster, type RasterSummary } from '../summary';
import type { ModelFile } from '../../schemas/model';

export interface DraftCheck {
  errors: ModelPathIssue[];
  warnings: string[];
  /** Size and velocity range of the rasterised draft; absent when it has errors. */
  summary?: RasterSummary;
}

/** True when the grid can be allocated and drawn: whole counts, positive finite spacing, within MAX_GRID_NODES. */
export function gridIsUsable(g: Grid | undefined): g is Grid {
  if (!g) return false;
  const { x0, dx, nx, z0, dz, nz } = g;
  return [x0, dx, z0, dz].every(Number.isFinite) && dx > 0 && dz > 0 && Number.isInteger(nx) && Number.isInteger(nz) && nx >= 2 && nz >= 2 && nx * nz <= MAX_GRID_NODES;
}

export function checkDraft(model: ModelFile, raster?: RasterModel): DraftCheck {
  const parsed = parseModelFile(model);
  const errors: ModelPathIssue[] = parsed.ok ? [] : [...parsed.issues];
  errors.push(...interfacesInsideGrid(model));
  if (errors.length || !parsed.ok) return { errors, warnings: [] };
  const summary = summariseRaster(raster ?? rasteriseModel(parsed.model));
  return { errors, warnings: summary.warnings, summary };
}

/** Every base node must lie between the grid's top and bottom rows (x coverage is a rule of the format itself). */
export function interfacesInsideGrid(model: ModelFile): ModelPathIssue[] {
  const g = model.grid;
  if (!gridIsUsable(g)) return [];
  const eps = 1e-6 * g.dz;
  const bottom = g.z0 - (g.nz - 1) * g.dz;
  const issues: ModelPathIssue[] = [];
  model.layers?.forEach((layer, k) => {
    layer.base?.forEach(([x, z], i) => {
      const path = formatJsonPath(['layers', k, 'base', i]);
      if (z > g.z0 + eps) issues.push({ path, message: `z = ${z} m (at x = ${x} m) is above the grid top (z = ${g.z0} m)` });
      else if (z < bottom - eps) issues.push({ path, message: `z = ${z} m (at x = ${x} m) is below the grid bottom (z = ${+bottom.toFixed(6)} m)` });
    });
  });
  return issues;
}
