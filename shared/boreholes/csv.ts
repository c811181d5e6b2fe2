import { parseDecimal, splitCsvLine } from '../picks/fields';
import { boreholeBody, type BoreholeBody } from '../schemas/boreholes';
import { notTextMessage } from '../files/not-text';

/** One problem in a borehole file, tied to its line (1-based) and column. */
export interface BoreholeFileIssue {
  line: number | null;
  column: string | null;
  message: string;
}

export type BoreholeCsvResult = { ok: true; boreholes: (BoreholeBody & { line: number })[] } | { ok: false; issues: BoreholeFileIssue[] };

const COLUMNS = ['hole', 'kind', 'x', 'ground_z', 'water_depth', 'depth', 'material', 'rock_top'] as const;
type Column = (typeof COLUMNS)[number];
const REQUIRED: Column[] = ['hole', 'x', 'depth', 'material'];
/** Columns every row of one hole must repeat alike. */
const PER_HOLE: Column[] = ['kind', 'x', 'ground_z', 'water_depth'];
const YES = new Set(['yes', 'y', 'true', '1']), NO = new Set(['', 'no', 'n', 'false', '0']);
/** The form's field name for each file column, so a schema issue lands on the right column. */
const FIELD_COLUMN: Record<string, Column> = { name: 'hole', kind: 'kind', x: 'x', groundZ: 'ground_z', waterDepth: 'water_depth', depth: 'depth', material: 'material', rockTop: 'rock_top' };

/**
 * A borehole file (docs/boreholes.md): a header row (names in any order and case), '#' comments, one
 * row per logged contact; the rows of a hole share kind, x, ground_z and water_depth. Each hole is then
 * checked by the same schema as the form (shared/schemas/boreholes.ts), so a file and the form refuse
 * the same things. Any problem rejects the whole file; each names its line and column.
 */
export function parseBoreholeCsv(text: string): BoreholeCsvResult {
  const notText = notTextMessage(text, 'a borehole file (CSV text)');
  if (notText) return { ok: false, issues: [{ line: 1, column: null, message: notText }] };
  const issues: BoreholeFileIssue[] = [];
  const lines = text.split(/\r?\n/);
  let header: Partial<Record<Column, number>> | null = null;
  const holes = new Map<string, { line: number; lines: number[]; cells: Record<Column, string>; contacts: { depth: number; material: string; rockTop: boolean }[] }>();

  for (let i = 0; i < lines.length && issues.length < 100; i++) {
    const raw = lines[i].trim();
    const line = i + 1;
    if (raw === '' || raw.startsWith('#')) continue;
    const cells = splitCsvLine(raw).map((c) => c.trim());
    if (!header) {
      const names = cells.map((c) => c.toLowerCase());
      const missing = REQUIRED.filter((c) => !names.includes(c));
      if (missing.length) return { ok: false, issues: [{ line, column: null, message: `the header must name the columns ${COLUMNS.join(', ')} (kind, ground_z, water_depth and rock_top may be left out); missing: ${missing.join(', ')}` }] };
      const unknown = names.filter((n) => !(COLUMNS as readonly string[]).includes(n));
      if (unknown.length) return { ok: false, issues: [{ line, column: null, message: `unknown column ${unknown.map((u) => `"${u.slice(0, 30)}"`).join(', ')}; the columns are ${COLUMNS.join(', ')}` }] };
      header = Object.fromEntries(COLUMNS.filter((c) => names.includes(c)).map((c) => [c, names.indexOf(c)]));
      continue;
    }
    const cell = (c: Column) => (header![c] === undefined ? '' : (cells[header![c]!] ?? ''));
    const row = Object.fromEntries(COLUMNS.map((c) => [c, cell(c)])) as Record<Column, string>;
    const name = row.hole;
    if (!name) {
      issues.push({ line, column: 'hole', message: 'is empty: name the hole, e.g. BH1' });
      continue;
    }
    const depth = parseDecimal(row.depth);
    if (depth === null) issues.push({ line, column: 'depth', message: row.depth === '' ? 'is empty' : `"${row.depth.slice(0, 30)}" is not a number` });
    const flag = row.rock_top.toLowerCase();
    if (!YES.has(flag) && !NO.has(flag)) issues.push({ line, column: 'rock_top', message: `"${row.rock_top.slice(0, 30)}" is not yes or no` });
    const hole = holes.get(name);
    if (!hole) holes.set(name, { line, lines: [line], cells: row, contacts: [] });
    else {
      for (const c of PER_HOLE) {
        if (row[c] !== hole.cells[c]) issues.push({ line, column: c, message: `"${row[c]}" differs from "${hole.cells[c]}" on line ${hole.line}; every row of ${name} must give the same ${c}` });
      }
      hole.lines.push(line);
    }
    holes.get(name)!.contacts.push({ depth: depth ?? NaN, material: row.material, rockTop: YES.has(flag) });
  }
  if (!header) return { ok: false, issues: [{ line: null, column: null, message: `the file is empty: expected a header row (${COLUMNS.join(',')}) and one row per logged contact` }] };
  if (!holes.size && !issues.length) return { ok: false, issues: [{ line: null, column: null, message: 'the file has a header but no rows' }] };
  if (issues.length) return { ok: false, issues };

  const boreholes: (BoreholeBody & { line: number })[] = [];
  for (const [name, hole] of holes) {
    const number = (c: Column, what: string): number | null | undefined => {
      const text = hole.cells[c];
      if (text === '') return null;
      const n = parseDecimal(text);
      if (n === null) issues.push({ line: hole.line, column: c, message: `"${text.slice(0, 30)}" is not a number (${what})` });
      return n ?? undefined;
    };
    const x = number('x', 'position along the line, m');
    const groundZ = number('ground_z', 'ground elevation, m; leave empty to take it from the stations');
    const waterDepth = number('water_depth', 'depth to water, m; leave empty when none was logged');
    if (x === null) issues.push({ line: hole.line, column: 'x', message: 'is empty' });
    const kind = hole.cells.kind.toLowerCase().replace(/[\s-]+/g, '_') || 'borehole';
    const parsed = boreholeBody.safeParse({ name, kind, x, groundZ, waterDepth, contacts: hole.contacts });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const [field, index, sub] = issue.path;
        const contactLine = field === 'contacts' && typeof index === 'number' ? hole.lines[index] : hole.line;
        issues.push({ line: contactLine, column: FIELD_COLUMN[String(field === 'contacts' ? sub : field)] ?? null, message: issue.message });
      }
      continue;
    }
    boreholes.push({ ...parsed.data, line: hole.line });
  }
  return issues.length ? { ok: false, issues } : { ok: true, boreholes };
}
