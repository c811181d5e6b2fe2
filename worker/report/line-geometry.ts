/** Quantities of the line that several sections print: its x range, station spacing, ground line. */
import { nodeX } from '../../shared/grid';
import type { ModelFile, RasterModel } from '../../shared/model';
import type { Range } from './plot';
import type { ReportInput } from './types';

/** The model's extent along the line: every along-line figure shares it, so they line up. */
export function lineRange(model: RasterModel): Range {
  return { min: model.grid.x0, max: nodeX(model.grid, model.grid.nx - 1) };
}

/** Typical station spacing (median gap between neighbouring stations), m; null with < 2 stations. */
export function stationSpacing(stations: readonly { x: number }[]): number | null {
  const xs = stations.map((s) => s.x).sort((a, b) => a - b);
  const gaps = xs.slice(1).map((x, i) => x - xs[i]).filter((g) => g > 0).sort((a, b) => a - b);
  if (gaps.length === 0) return null;
  const mid = gaps.length >> 1;
  return gaps.length % 2 ? gaps[mid] : (gaps[mid - 1] + gaps[mid]) / 2;
}

/**
 * A polyline z(x) of the model file (surface or a layer base) over the model's extent, x, z pairs (m):
 * its own vertices inside the extent plus the two ends, so the drawn line is exactly the model's.
 */
export function polylineOverLine(model: RasterModel, at: (x: number) => number, vertices: readonly (readonly [number, number])[] | undefined): number[] {
  const { min, max } = lineRange(model);
  const xs = [min, ...(vertices ?? []).map((p) => p[0]).filter((x) => x > min && x < max), max];
  return xs.flatMap((x) => [x, at(x)]);
}

/** The ground surface over the model's extent. */
export function groundLine(model: RasterModel, file: ModelFile): number[] {
  return polylineOverLine(model, model.surfaceZ, file.surface as [number, number][] | undefined);
}

/** Picks per shot (all, and excluded), from the residual rows. */
export function picksPerShot(input: ReportInput): Map<string, { picks: number; excluded: number }> {
  const out = new Map<string, { picks: number; excluded: number }>();
  for (const r of input.residuals) {
    const c = out.get(r.shotId) ?? { picks: 0, excluded: 0 };
    c.picks++;
    if (r.excluded) c.excluded++;
    out.set(r.shotId, c);
  }
  return out;
}
