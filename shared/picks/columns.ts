/** The pick file's columns (FORMATS.md §2) and reading the header row. */
import type { PickError } from './types';

export const PICK_COLUMNS = ['shot_id', 'source_x', 'source_z', 'receiver_x', 'receiver_z', 'time_ms', 'sigma_ms'] as const;
export type PickColumn = (typeof PICK_COLUMNS)[number];
export const REQUIRED_PICK_COLUMNS: readonly PickColumn[] = ['shot_id', 'source_x', 'receiver_x', 'time_ms'];

/** Field index of each column in the file; -1 when an optional column is absent (all its values empty). */
export type ColumnIndex = Record<PickColumn, number>;

export function readHeader(fields: string[], line: number): { index: ColumnIndex; fieldCount: number } | { errors: PickError[] } {
  const names = fields.map((f) => f.trim().toLowerCase());
  const known = new Set<string>(PICK_COLUMNS);
  const errors: PickError[] = [];
  if (!names.some((n) => known.has(n))) {
    return {
      errors: [{
        line,
        column: null,
        message: `the first line that is not a comment must be the header naming the columns (${PICK_COLUMNS.join(',')}); found ${JSON.stringify(clip(fields.join(',')))}`,
      }],
    };
  }
  const index = Object.fromEntries(PICK_COLUMNS.map((c) => [c, -1])) as ColumnIndex;
  names.forEach((name, i) => {
    if (!known.has(name)) {
      errors.push({ line, column: name || `(column ${i + 1})`, message: `unknown column; expected some of ${PICK_COLUMNS.join(', ')}` });
    } else if (index[name as PickColumn] !== -1) {
      errors.push({ line, column: name, message: 'column appears twice in the header' });
    } else {
      index[name as PickColumn] = i;
    }
  });
  for (const c of REQUIRED_PICK_COLUMNS) {
    if (index[c] === -1) errors.push({ line, column: c, message: 'required column is missing from the header' });
  }
  return errors.length ? { errors } : { index, fieldCount: fields.length };
}

export const clip = (s: string, n = 40): string => (s.length > n ? `${s.slice(0, n)}…` : s);
