import { outOfRange, X_RANGE, Z_RANGE } from '../limits';
import { parseDecimal, splitCsvLine } from '../picks/fields';
import type { Station } from '../schemas/stations';
import { checkStationTable, type StationIssue } from './rules';
import { notTextMessage } from '../files/not-text';

const COLUMNS = ['station', 'x', 'z'] as const;

export type StationCsvResult = { ok: true; stations: Station[] } | { ok: false; issues: StationIssue[] };

/**
 * A station CSV: header row naming station, x, z (any order, any case), '#' comments, blank lines
 * ignored. Any error rejects the whole table; each issue names the file line and the column.
 */
export function parseStationCsv(text: string): StationCsvResult {
  const notText = notTextMessage(text, 'a station table (CSV text)');
  if (notText) return { ok: false, issues: [{ row: 0, line: 1, column: null, message: notText }] };
  const issues: StationIssue[] = [];
  const stations: Station[] = [];
  const lines = text.split(/\r?\n/);
  let header: Record<(typeof COLUMNS)[number], number> | null = null;
  const rowLines: number[] = [];

  for (let i = 0; i < lines.length && issues.length < 100; i++) {
    const raw = lines[i].trim();
    const line = i + 1;
    if (raw === '' || raw.startsWith('#')) continue;
    const cells = splitCsvLine(raw).map((c) => c.trim());
    if (!header) {
      const names = cells.map((c) => c.toLowerCase());
      const missing = COLUMNS.filter((c) => !names.includes(c));
      if (missing.length) {
        return { ok: false, issues: [{ row: 0, line, column: null, message: `the header must name the columns station, x, z; missing: ${missing.join(', ')}` }] };
      }
      header = { station: names.indexOf('station'), x: names.indexOf('x'), z: names.indexOf('z') };
      continue;
    }
    const row = rowLines.length + 1;
    rowLines.push(line);
    const value = (col: (typeof COLUMNS)[number]): number => {
      const cell = cells[header![col]] ?? '';
      const n = cell === '' ? null : parseDecimal(cell);
      if (n === null) issues.push({ row, line, column: col, message: cell === '' ? 'is empty' : `"${cell.slice(0, 30)}" is not a number` });
      return n ?? NaN;
    };
    const station = value('station');
    const x = value('x');
    const z = value('z');
    if (Number.isFinite(station) && (!Number.isInteger(station) || station <= 0)) {
      issues.push({ row, line, column: 'station', message: 'must be a positive whole number' });
    }
    // Plausible ranges (shared/limits.ts), so a typo such as 1e15 is refused here rather than stored.
    const xProblem = Number.isFinite(x) ? outOfRange(x, X_RANGE) : null;
    if (xProblem) issues.push({ row, line, column: 'x', message: xProblem });
    const zProblem = Number.isFinite(z) ? outOfRange(z, Z_RANGE) : null;
    if (zProblem) issues.push({ row, line, column: 'z', message: zProblem });
    stations.push({ station, x, z });
  }
  if (!header) return { ok: false, issues: [{ row: 0, column: null, message: 'the file is empty: expected a header row station,x,z and one row per station' }] };
  if (!stations.length && !issues.length) return { ok: false, issues: [{ row: 0, column: null, message: 'the file has a header but no stations' }] };
  if (!issues.length) {
    for (const issue of checkStationTable(stations)) issues.push({ ...issue, line: rowLines[issue.row - 1] });
  }
  return issues.length ? { ok: false, issues } : { ok: true, stations };
}
