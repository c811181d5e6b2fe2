import { outOfRange, X_RANGE, Z_RANGE } from '../limits';
import { parseDecimal, splitCsvLine } from '../picks/fields';
import type { Station } from '../schemas/stations';
import { chainageAlong, coordinateProblems } from '../geo/chainage';
import { checkStationTable, type StationIssue } from './rules';
import { notTextMessage } from '../files/not-text';

type Column = 'station' | 'x' | 'z' | 'easting' | 'northing' | 'lon' | 'lat';
const KNOWN: Column[] = ['station', 'x', 'z', 'easting', 'northing', 'lon', 'lat'];

export type StationCsvResult = { ok: true; stations: Station[] } | { ok: false; issues: StationIssue[] };

/**
 * Turns WGS 84 longitude/latitude (degrees, from a GNSS export) into the project's easting and
 * northing, or says why it cannot (no project CRS, outside its area of use).
 */
export type LonLatToMap = (lon: number, lat: number) => [number, number] | string;

export interface StationCsvOptions {
  /** Needed only for files with lon/lat columns. */
  lonLatToMap?: LonLatToMap;
}

/**
 * A station CSV: header row naming station, z and the position: chainage x, and/or easting and
 * northing in the project's coordinate reference system, or lon and lat (WGS 84 degrees, turned into
 * easting and northing). Without x, the chainage is the distance along the line through the stations
 * in file order, 0 at the first. Any order, any case, '#' comments, blank lines ignored. Any error
 * rejects the whole table; each issue names the file line and the column.
 */
export function parseStationCsv(text: string, options: StationCsvOptions = {}): StationCsvResult {
  const notText = notTextMessage(text, 'a station table (CSV text)');
  if (notText) return { ok: false, issues: [{ row: 0, line: 1, column: null, message: notText }] };
  const issues: StationIssue[] = [];
  const rows: { station: number; x: number | null; z: number; easting: number | null; northing: number | null }[] = [];
  const lines = text.split(/\r?\n/);
  let header: Partial<Record<Column, number>> | null = null;
  let headerLine = 0;
  const rowLines: number[] = [];

  for (let i = 0; i < lines.length && issues.length < 100; i++) {
    const raw = lines[i].trim();
    const line = i + 1;
    if (raw === '' || raw.startsWith('#')) continue;
    const cells = splitCsvLine(raw).map((c) => c.trim());
    if (!header) {
      const names = cells.map((c) => c.toLowerCase());
      const problem = headerProblem(names);
      if (problem) return { ok: false, issues: [{ row: 0, line, column: null, message: problem }] };
      header = Object.fromEntries(KNOWN.filter((c) => names.includes(c)).map((c) => [c, names.indexOf(c)]));
      headerLine = line;
      if (header.lon !== undefined && !options.lonLatToMap) {
        return { ok: false, issues: [{ row: 0, line, column: 'lon', message: 'longitude and latitude need the project’s coordinate reference system: set it on the project page, or give easting and northing' }] };
      }
      continue;
    }
    const row = rowLines.length + 1;
    rowLines.push(line);
    const value = (col: Column): number => {
      const cell = cells[header![col]!] ?? '';
      const n = cell === '' ? null : parseDecimal(cell);
      if (n === null) issues.push({ row, line, column: col, message: cell === '' ? 'is empty' : `"${cell.slice(0, 30)}" is not a number` });
      return n ?? NaN;
    };
    const has = (col: Column) => header![col] !== undefined;
    const station = value('station');
    const x = has('x') ? value('x') : null;
    const z = value('z');
    if (Number.isFinite(station) && (!Number.isInteger(station) || station <= 0)) {
      issues.push({ row, line, column: 'station', message: 'must be a positive whole number' });
    }
    // Plausible ranges (shared/limits.ts), so a typo such as 1e15 is refused here rather than stored.
    const xProblem = x !== null && Number.isFinite(x) ? outOfRange(x, X_RANGE) : null;
    if (xProblem) issues.push({ row, line, column: 'x', message: xProblem });
    const zProblem = Number.isFinite(z) ? outOfRange(z, Z_RANGE) : null;
    if (zProblem) issues.push({ row, line, column: 'z', message: zProblem });
    let easting: number | null = null, northing: number | null = null;
    if (has('easting')) {
      easting = value('easting');
      northing = value('northing');
      for (const [col, v] of [['easting', easting], ['northing', northing]] as const) {
        const p = Number.isFinite(v) ? outOfRange(v, X_RANGE) : null;
        if (p) issues.push({ row, line, column: col, message: p });
      }
    } else if (has('lon')) {
      const lon = value('lon'), lat = value('lat');
      if (Number.isFinite(lon) && Number.isFinite(lat)) {
        if (Math.abs(lon) > 180 || Math.abs(lat) > 90) issues.push({ row, line, column: Math.abs(lon) > 180 ? 'lon' : 'lat', message: 'is not a longitude/latitude in degrees' });
        else {
          const map = options.lonLatToMap!(lon, lat);
          if (typeof map === 'string') issues.push({ row, line, column: 'lon', message: map });
          else [easting, northing] = map;
        }
      }
    }
    rows.push({ station, x, z, easting, northing });
  }
  if (!header) return { ok: false, issues: [{ row: 0, column: null, message: 'the file is empty: expected a header row station,x,z and one row per station' }] };
  if (!rows.length && !issues.length) return { ok: false, issues: [{ row: 0, line: headerLine, column: null, message: 'the file has a header but no stations' }] };
  if (issues.length) return { ok: false, issues };
  const located = rows[0].easting !== null;
  const points = rows.map((r) => ({ easting: r.easting!, northing: r.northing! }));
  if (header.x === undefined) {
    // The chainage comes from the coordinates alone: they must hold together on their own (no jumps either).
    for (const p of coordinateProblems(points)) issues.push({ row: p.index + 1, line: rowLines[p.index], column: 'easting', message: p.message });
    if (issues.length) return { ok: false, issues };
  }
  const chainage = header.x !== undefined ? rows.map((r) => r.x!) : chainageAlong(points);
  const stations: Station[] = rows.map((r, i) => ({
    station: r.station,
    x: +chainage[i].toFixed(4),
    z: r.z,
    ...(located ? { easting: r.easting!, northing: r.northing! } : {}),
  }));
  for (const issue of checkStationTable(stations)) issues.push({ ...issue, line: rowLines[issue.row - 1] });
  return issues.length ? { ok: false, issues } : { ok: true, stations };
}

/** What is wrong with a header row, or null: station and z always, and a position (x, easting+northing or lon+lat). */
function headerProblem(names: string[]): string | null {
  const missing = (['station', 'z'] as const).filter((c) => !names.includes(c));
  if (missing.length) return `the header must name the columns station, x, z (or station, easting, northing, z); missing: ${missing.join(', ')}`;
  const pair = (a: string, b: string) => names.includes(a) !== names.includes(b) ? `the header names ${names.includes(a) ? a : b} without ${names.includes(a) ? b : a}: give both` : null;
  const unpaired = pair('easting', 'northing') ?? pair('lon', 'lat');
  if (unpaired) return unpaired;
  if (names.includes('easting') && names.includes('lon')) return 'the header names both easting/northing and lon/lat: give one kind of coordinates';
  if (!names.includes('x') && !names.includes('easting') && !names.includes('lon')) return 'the header must name the columns station, x, z; missing: x (or give easting and northing, or lon and lat, to have x computed along the line)';
  return null;
}
