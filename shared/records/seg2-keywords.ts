import { RecordFormatError } from './errors';
import type { RecordPoint } from './types';
import type { Seg2String } from './seg2-strings';

/** Metres per unit of the SEG-2 UNITS keyword (Pullan 1990 lists METERS, FEET, INCHES, CENTIMETERS, NONE). */
const METRES_PER_UNIT: Record<string, number> = { METERS: 1, METRES: 1, FEET: 0.3048, INCHES: 0.0254, CENTIMETERS: 0.01, CENTIMETRES: 0.01, NONE: 1 };
const MONTHS = ['JAN', 'FEB', 'MAR', 'APR', 'MAY', 'JUN', 'JUL', 'AUG', 'SEP', 'OCT', 'NOV', 'DEC'];

/** Keyword lookup for one trace: the trace's own strings first, then the file's (UNITS, DELAY … may sit at either level). */
export class Seg2Keywords {
  private readonly own = new Map<string, Seg2String>();
  private readonly file = new Map<string, Seg2String>();

  constructor(fileStrings: Seg2String[], traceStrings: Seg2String[], private readonly where: string) {
    for (const s of fileStrings) this.file.set(s.key, s);
    for (const s of traceStrings) this.own.set(s.key, s);
  }

  get(key: string): Seg2String | undefined {
    return this.own.get(key) ?? this.file.get(key);
  }

  /** A keyword's value as one number; null when absent. */
  number(key: string): number | null {
    const s = this.get(key);
    if (!s) return null;
    const n = parseNumber(s.value.trim());
    if (n === null) throw new RecordFormatError(s.offset, `${this.where}: ${key} must be a number (got "${s.value.slice(0, 40)}")`);
    return n;
  }

  /** RECEIVER_LOCATION / SOURCE_LOCATION: one to three numbers x [y [z]] in UNITS, converted to metres. */
  point(key: string): RecordPoint | null {
    const s = this.get(key);
    if (!s) return null;
    const parts = s.value.trim().split(/[\s,]+/).filter(Boolean).map(parseNumber);
    if (parts.length < 1 || parts.length > 3 || parts.some((p) => p === null)) {
      throw new RecordFormatError(s.offset, `${this.where}: ${key} must be one to three numbers x [y [z]] (got "${s.value.slice(0, 40)}")`);
    }
    const k = this.metresPerUnit();
    const [x, y, z] = parts as number[];
    return { x: x * k, y: y === undefined ? null : y * k, z: z === undefined ? null : z * k };
  }

  metresPerUnit(): number {
    const s = this.get('UNITS');
    if (!s) return 1; // the standard's default unit is the metre
    const k = METRES_PER_UNIT[s.value.trim().toUpperCase()];
    if (k === undefined) throw new RecordFormatError(s.offset, `${this.where}: UNITS must be one of ${Object.keys(METRES_PER_UNIT).join(', ')} (got "${s.value.slice(0, 40)}")`);
    return k;
  }
}

/** Plain decimal or exponent notation, nothing else (no hex, no Infinity). */
export function parseNumber(text: string): number | null {
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text)) return null;
  const n = Number(text);
  return Number.isFinite(n) ? n : null;
}

/** ACQUISITION_DATE "DD/MMM/YYYY" and ACQUISITION_TIME "HH:MM:SS[.sss]" (Pullan 1990) as ISO 8601; null when absent or not in that form. */
export function acquisitionTime(date: string | undefined, time: string | undefined): string | null {
  const d = date && /^\s*(\d{1,2})\/([A-Za-z]{3})\/(\d{4})\s*$/.exec(date);
  if (!d) return null;
  const month = MONTHS.indexOf(d[2].toUpperCase());
  if (month < 0 || +d[1] < 1 || +d[1] > 31) return null;
  const day = `${d[3]}-${String(month + 1).padStart(2, '0')}-${d[1].padStart(2, '0')}`;
  const t = time && /^\s*(\d{1,2}):(\d{2}):(\d{2}(?:\.\d+)?)\s*$/.exec(time);
  if (!t) return day;
  return `${day}T${t[1].padStart(2, '0')}:${t[2]}:${t[3].padStart(2, '0')}`;
}
