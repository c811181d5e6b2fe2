/**
 * Coordinate reference systems by EPSG code, offline: definitions from the `epsg-index` package (a
 * machine-readable copy of the EPSG dataset with PROJ strings, areas of use and units), transformations
 * by `proj4`. Server-side only: the index is tens of megabytes and never goes to the browser.
 */
import { createRequire } from 'node:module';
import proj4 from 'proj4';

interface EpsgEntry {
  code: string;
  kind: string;
  name: string;
  proj4: string | null;
  /** Area of use: north, west, south, east (degrees). */
  bbox: [number, number, number, number] | null;
  unit: string | null;
  area: string | null;
}

export interface CrsInfo {
  code: number;
  name: string;
  /** 'projected' coordinates are easting/northing in metres; 'geographic' are degrees. */
  kind: 'projected' | 'geographic';
  area: string;
  /** north, west, south, east (degrees). */
  bbox: [number, number, number, number] | null;
  /** Why longitude/latitude cannot be converted to or from this CRS here, or null when they can. */
  noDatumShift: string | null;
}

/** A request the CRS cannot serve: the message is for the user as it stands. */
export class CrsError extends Error {}

const require = createRequire(import.meta.url);
let index: Record<string, EpsgEntry> | null = null;
const entries = (): Record<string, EpsgEntry> => (index ??= require('epsg-index/all.json') as Record<string, EpsgEntry>);

/**
 * Datum shifts some definitions take from a grid file (NTv2) that is not shipped. Where the EPSG
 * dataset also publishes a seven-parameter (Helmert) transformation for the datum, it stands in, at
 * its stated accuracy. OSGB 1936 → WGS 84: EPSG transformation 1314 ("OSGB36 to WGS 84 (6)"),
 * accuracy about 2 m (parameters from memory; checked against PROJ's cs2cs in the tests).
 */
const HELMERT_FALLBACK: { grid: RegExp; towgs84: string }[] = [
  { grid: /OSTN15_NTv2_OSGBtoETRS/, towgs84: '446.448,-125.157,542.06,0.15,0.247,0.842,-20.489' },
];

function usable(e: EpsgEntry | undefined): e is EpsgEntry & { proj4: string } {
  if (!e?.proj4) return false;
  if (e.kind === 'CRS-GEOGCRS') return true;
  // Easting first: a definition that swaps the axes (north-east grids) would swap them in every file.
  return e.kind === 'CRS-PROJCRS' && e.unit === 'metre' && !northFirst(e);
}

/** Variants of a grid that list northing first (named so in the EPSG dataset, or swapped in the definition). */
const northFirst = (e: EpsgEntry): boolean => /\+axis=(?!enu)/.test(e.proj4 ?? '') || /\((N-E|N-zE|zE-N)\)/.test(e.name);

/** The definition proj4 is given: grid shifts replaced by a published Helmert where there is one. */
function definition(e: EpsgEntry & { proj4: string }): { def: string; noDatumShift: string | null } {
  const grid = /\+nadgrids=(\S+)/.exec(e.proj4);
  if (!grid) return { def: e.proj4, noDatumShift: null };
  const fallback = HELMERT_FALLBACK.find((f) => f.grid.test(grid[1]));
  const stripped = e.proj4.replace(/\s*\+nadgrids=\S+/, '');
  if (fallback) return { def: `${stripped} +towgs84=${fallback.towgs84}`, noDatumShift: null };
  return { def: stripped, noDatumShift: `EPSG:${e.code} converts to longitude and latitude through a grid file (${grid[1]}) that Timefield does not carry` };
}

function info(e: EpsgEntry & { proj4: string }): CrsInfo {
  return { code: Number(e.code), name: e.name, kind: e.kind === 'CRS-GEOGCRS' ? 'geographic' : 'projected', area: e.area ?? '', bbox: e.bbox, noDatumShift: definition(e).noDatumShift };
}

/** The CRS of an EPSG code, or a CrsError saying why it cannot serve as a project's CRS. */
export function crsByCode(code: number): CrsInfo {
  const e = entries()[String(code)];
  if (!e) throw new CrsError(`EPSG:${code} is not a coordinate reference system Timefield knows.`);
  if (!e.proj4) throw new CrsError(`EPSG:${code} (${e.name}) has no definition Timefield can compute with.`);
  if (e.kind === 'CRS-PROJCRS' && e.unit !== 'metre') throw new CrsError(`EPSG:${code} (${e.name}) is in ${e.unit ?? 'an unknown unit'}; Timefield works in metres: choose the metre version of the grid.`);
  if (northFirst(e)) throw new CrsError(`EPSG:${code} (${e.name}) gives northing before easting; choose the version of the grid with easting first.`);
  if (!usable(e)) throw new CrsError(`EPSG:${code} (${e.name}) is not a projected or geographic 2-D CRS.`);
  return info(e);
}

/** Projected CRSs in metres (the ones a project can use) whose code starts with, or name contains, every word of q. */
export function searchCrs(q: string, limit = 25): CrsInfo[] {
  const words = q.toLowerCase().split(/\s+/).filter(Boolean);
  if (!words.length) return [];
  const out: CrsInfo[] = [];
  for (const e of Object.values(entries())) {
    if (!usable(e) || e.kind !== 'CRS-PROJCRS') continue;
    const hay = `${e.code} ${e.name}`.toLowerCase();
    if (words.every((w) => (/^\d+$/.test(w) ? e.code.startsWith(w) || hay.includes(w) : hay.includes(w)))) out.push(info(e));
    if (out.length >= limit) break;
  }
  return out;
}

const WGS84 = '+proj=longlat +datum=WGS84 +no_defs';

function converter(code: number): { forward: (p: [number, number]) => [number, number]; inverse: (p: [number, number]) => [number, number] } {
  const e = entries()[String(code)] as EpsgEntry & { proj4: string };
  const crs = crsByCode(code);
  if (crs.noDatumShift) throw new CrsError(`${crs.noDatumShift}.`);
  const c = proj4(WGS84, definition(e).def);
  return { forward: (p) => c.forward(p) as [number, number], inverse: (p) => c.inverse(p) as [number, number] };
}

/** WGS 84 longitude/latitude (degrees) → the CRS's easting/northing (m). */
export function fromLonLat(code: number, lon: number, lat: number): [number, number] {
  return converter(code).forward([lon, lat]);
}

/** The CRS's easting/northing (m) → WGS 84 longitude/latitude (degrees). */
export function toLonLat(code: number, easting: number, northing: number): [number, number] {
  return converter(code).inverse([easting, northing]);
}

/** Whether a WGS 84 point lies in the CRS's area of use (its bounding box; one that crosses 180° wraps). */
export function insideArea(crs: CrsInfo, lon: number, lat: number): boolean {
  if (!crs.bbox) return true;
  const [north, west, south, east] = crs.bbox;
  if (lat > north + 1e-9 || lat < south - 1e-9) return false;
  return west <= east ? lon >= west - 1e-9 && lon <= east + 1e-9 : lon >= west - 1e-9 || lon <= east + 1e-9;
}
