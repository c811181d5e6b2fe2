/**
 * Section "Depth to the v* surface" of an inversion: the depth below ground where the inverted
 * velocity first reaches v* at every station (shared/model/iso-depth, as for a forward model),
 * kept only where the rays say something: a crossing below the depth of investigation, or at a
 * node crossed by less ray than the coverage threshold, is "not resolved".
 */
import type { IsoDepth } from '../../../shared/model/iso-depth';
import { NOT_REACHED_ABOVE_DOI, resolvedIsoDepth, type IsoDepthStatus } from '../../../shared/model/resolved-iso-depth';
import { caption, paragraph, sectionHeading } from '../flow';
import { fixed, NONE, plain } from '../format';
import { drawBoreholes, type TieSurface } from '../boreholes';
import { drawTable } from '../table';
import type { InversionContext } from './context';
import { drawMapDepthTable } from '../map-depths';

export { BELOW_DOI, NO_RAYS, NOT_REACHED_ABOVE_DOI, OUTSIDE_GRID, UNCOVERED, type IsoDepthStatus } from '../../../shared/model/resolved-iso-depth';

export interface StationIsoDepth {
  station: number | string;
  x: number;
  result: IsoDepth | null;
  status: IsoDepthStatus;
}

/** Depth of the first v* crossing at x and whether the inversion resolves it there (shared/model/resolved-iso-depth.ts). */
export function inversionIsoDepth(ctx: InversionContext, velocity: number, x: number): { result: IsoDepth | null; status: IsoDepthStatus } {
  return resolvedIsoDepth(ctx, velocity, x);
}

/**
 * Section "Boreholes and ties" of an inversion report: the contacts against the iso-velocity surface
 * where the inversion resolves it, and why not where it does not.
 */
export function drawInversionBoreholes(ctx: InversionContext): void {
  const v = ctx.input.isoVelocity;
  const surface: TieSurface = {
    name: `the ${plain(v, 0)} m/s surface`,
    depthAt: (x) => {
      const r = inversionIsoDepth(ctx, v, x);
      return r.status === 'resolved' ? (r.result?.depth ?? null) : null;
    },
    noneText: (x) => {
      const r = inversionIsoDepth(ctx, v, x);
      return r.status === 'resolved' ? NOT_REACHED_ABOVE_DOI : r.status;
    },
  };
  drawBoreholes(ctx, 'boreholes', ctx.input.boreholes ?? [], [surface], ctx.input.stations);
}

export function stationIsoDepths(ctx: InversionContext): StationIsoDepth[] {
  return [...ctx.input.stations].sort((a, b) => a.x - b.x).map((s) => ({ station: s.station, x: s.x, ...inversionIsoDepth(ctx, ctx.input.isoVelocity, s.x) }));
}

export function drawInversionIsoDepth(ctx: InversionContext): void {
  const { input } = ctx;
  sectionHeading(ctx, 'isoDepth');
  const v = plain(input.isoVelocity, 0);
  const rows = stationIsoDepths(ctx);
  const resolved = rows.filter((r) => r.status === 'resolved');
  const depths = resolved.map((r) => r.result!.depth!);
  paragraph(
    ctx,
    `Depth below the ground surface at which the inverted velocity first reaches ${v} m/s, a velocity chosen by the geophysicist to mark a boundary of engineering interest (for example the top of rock). ` +
      `It is read from the final model between node rows ${plain(ctx.grid.dz, 3)} m apart. Tomography smooths a sharp contact into a gradient, so this depth marks where the gradient passes ${v} m/s, not a contact; it is given only where the inversion resolves it: ` +
      `above the depth of investigation and at a node crossed by at least ${plain(ctx.threshold, 2)} m of ray.`,
  );
  paragraph(
    ctx,
    resolved.length
      ? `At ${resolved.length} of ${rows.length} stations the ${v} m/s surface lies ${fixed(Math.min(...depths), 1)} m to ${fixed(Math.max(...depths), 1)} m below ground; at the others it is not resolved or not reached.`
      : `The ${v} m/s surface is not resolved at any station.`,
  );
  ctx.ensureSpace(60);
  const table = caption(ctx, 'Table', `Depth to the ${v} m/s surface at the stations: ground elevation, depth below ground and elevation of the surface (m), or why there is none.`);
  ctx.y -= 8;
  drawTable(ctx, {
    continued: `Table ${table} (continued)`,
    columns: [
      { title: 'Station', width: 55 },
      { title: 'x (m)', width: 55, align: 'right' },
      { title: 'Ground elevation (m)', width: 95, align: 'right' },
      { title: 'Depth below ground (m)', width: 170, align: 'right' },
      { title: 'Elevation of surface (m)', width: 104, align: 'right' },
    ],
    rows: rows.map((r) => {
      const head = [String(r.station), fixed(r.x, 2), r.result ? fixed(r.result.groundZ, 2) : NONE];
      if (r.status !== 'resolved') return [...head, r.status, NONE];
      return [...head, fixed(r.result!.depth, 1), fixed(r.result!.elevation, 1)];
    }),
  });
  const byStation = new Map(input.stations.map((s) => [String(s.station), s]));
  drawMapDepthTable(
    ctx,
    rows.map((r) => {
      const ok = r.status === 'resolved';
      return { ...byStation.get(String(r.station)), station: r.station, groundZ: r.result?.groundZ ?? null, depth: ok ? r.result!.depth : null, elevation: ok ? r.result!.elevation : null };
    }),
    `the ${v} m/s surface`,
    input.crs,
  );
}
