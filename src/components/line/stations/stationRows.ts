import { outOfRange, X_RANGE, Z_RANGE } from '../../../../shared/limits';
import type { Station } from '../../../api/types';

/**
 * The editable station table keeps what the user typed (strings) until save, so a
 * half-typed "12." is not lost; these helpers turn it into numbers and check the same
 * rules the server checks, so most mistakes are shown before anything is sent.
 */

export const STATION_COLUMNS = ['station', 'x', 'z'] as const;
export type StationColumn = (typeof STATION_COLUMNS)[number];

export interface DraftRow {
  /** Stable identity for React and for tying errors to a row while others are added or deleted. */
  key: number;
  station: string;
  x: string;
  z: string;
  /** Map coordinates from the saved table or a CSV, carried through hand edits unchanged (edit them by CSV). */
  easting?: number;
  northing?: number;
}

export const COLUMN_LABELS: Record<StationColumn, string> = { station: 'Station', x: 'x (m)', z: 'Elevation z (m)' };

let nextKey = 1;
export const newKey = () => nextKey++;

export function toDraft(stations: readonly Station[]): DraftRow[] {
  return stations.map((s) => ({ key: newKey(), station: String(s.station), x: String(s.x), z: String(s.z), ...(s.easting !== undefined ? { easting: s.easting, northing: s.northing } : {}) }));
}

/** A number as typed: empty is missing, anything else must be a finite decimal. */
function readNumber(text: string): number | null | 'bad' {
  const t = text.trim();
  if (t === '') return null;
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(t)) return 'bad';
  const n = Number(t);
  return Number.isFinite(n) ? n : 'bad';
}

export type RowErrors = Map<number, string[]>;

function addError(errors: RowErrors, key: number, message: string) {
  errors.set(key, [...(errors.get(key) ?? []), message]);
}

/** Check every row; returns the numbers when all are good, and messages keyed by row. */
export function checkRows(rows: readonly DraftRow[]): { stations: Station[] | null; errors: RowErrors } {
  const errors: RowErrors = new Map();
  const stations: Station[] = [];
  const seen = new Map<number, number>(); // station number → 1-based row
  let previousX: number | null = null;
  rows.forEach((row, i) => {
    const station = readNumber(row.station);
    const x = readNumber(row.x);
    const z = readNumber(row.z);
    if (station === null) addError(errors, row.key, 'Station: enter a station number.');
    else if (station === 'bad' || !Number.isInteger(station) || station <= 0) addError(errors, row.key, `Station: “${row.station.trim()}” is not a positive whole number.`);
    else if (seen.has(station)) addError(errors, row.key, `Station: ${station} is already used in row ${seen.get(station)}.`);
    else seen.set(station, i + 1);
    if (x === null) addError(errors, row.key, 'x: enter the distance along the line (m).');
    else if (x === 'bad') addError(errors, row.key, `x: “${row.x.trim()}” is not a number.`);
    else if (outOfRange(x, X_RANGE)) addError(errors, row.key, `x: ${outOfRange(x, X_RANGE)}.`);
    else {
      if (previousX !== null && x <= previousX) addError(errors, row.key, `x: must be greater than the row above (${previousX} m).`);
      previousX = x;
    }
    if (z === null) addError(errors, row.key, 'Elevation: enter the elevation (m).');
    else if (z === 'bad') addError(errors, row.key, `Elevation: “${row.z.trim()}” is not a number.`);
    else if (outOfRange(z, Z_RANGE)) addError(errors, row.key, `Elevation: ${outOfRange(z, Z_RANGE)}.`);
    if (typeof station === 'number' && typeof x === 'number' && typeof z === 'number') {
      stations.push(row.easting !== undefined && row.northing !== undefined ? { station, x, z, easting: row.easting, northing: row.northing } : { station, x, z });
    }
  });
  return { stations: errors.size === 0 ? stations : null, errors };
}

/** A new row continuing the table: next station number, same spacing, same elevation. */
export function nextRow(rows: readonly DraftRow[]): DraftRow {
  const last = rows.at(-1);
  const before = rows.at(-2);
  if (!last) return { key: newKey(), station: '1', x: '0', z: '' };
  const n = Number(last.station);
  const x = Number(last.x);
  const spacing = before ? x - Number(before.x) : NaN;
  return {
    key: newKey(),
    station: Number.isInteger(n) && n > 0 ? String(n + 1) : '',
    x: Number.isFinite(x) && Number.isFinite(spacing) && spacing > 0 ? String(+(x + spacing).toFixed(3)) : '',
    z: last.z,
  };
}

/**
 * Cells pasted from a spreadsheet (tab-separated; commas or semicolons accepted when no
 * tab is present). A first line with no number in it is taken as a header and skipped.
 */
export function parsePastedCells(text: string): string[][] {
  const lines = text.replace(/\r\n?/g, '\n').split('\n').filter((l) => l.trim() !== '');
  const sep = text.includes('\t') ? '\t' : /;/.test(text) ? ';' : ',';
  const cells = lines.map((l) => l.split(sep).map((c) => c.trim()));
  if (cells.length > 0 && cells[0].every((c) => readNumber(c) === 'bad' || c === '')) cells.shift();
  return cells;
}

/** Write pasted cells into the table from (row, column) on, adding rows as needed. */
export function applyPaste(rows: readonly DraftRow[], startRow: number, startColumn: number, cells: string[][]): DraftRow[] {
  const out = rows.map((r) => ({ ...r }));
  cells.forEach((line, r) => {
    const target = startRow + r;
    if (target >= out.length) out.push({ key: newKey(), station: '', x: '', z: '' });
    line.forEach((value, c) => {
      const column = STATION_COLUMNS[startColumn + c];
      if (column) out[target][column] = value;
    });
  });
  return out;
}

export const sameStations = (rows: readonly DraftRow[], saved: readonly Station[]): boolean =>
  rows.length === saved.length &&
  rows.every((r, i) => Number(r.station) === saved[i].station && Number(r.x) === saved[i].x && Number(r.z) === saved[i].z && r.x.trim() !== '' && r.z.trim() !== '');
