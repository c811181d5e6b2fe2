/**
 * Streaming pick-file parser (FORMATS.md §2). Feed string chunks with push(), then finish().
 * A file with any error yields no picks; up to `maxErrors` errors are collected, then parsing
 * stops. Binary or non-UTF-8 content, an oversized file or too many rows stop at once.
 */
import { MAX_PICK_FILE_BYTES, MAX_PICK_ROWS, outOfRange, SIGMA_MS_RANGE, TIME_MS_RANGE, X_RANGE, Z_RANGE, type NumberRange } from '../limits';
import { msToS } from '../units';
import { clip, readHeader, type ColumnIndex, type PickColumn } from './columns';
import { parseDecimal, splitCsvLine } from './fields';
import { atSource, PickSetTracker } from './pick-set';
import type { Pick, PickError, PickParseResult } from './types';
import { notTextKind } from '../files/not-text';

export interface PickParserOptions {
  maxErrors?: number;
  maxRows?: number;
  /** Limit on characters fed (≈ bytes for the ASCII a pick file holds; the upload limit counts bytes). */
  maxChars?: number;
}

export interface PickParser {
  push(chunk: string): void;
  finish(): PickParseResult;
}

const DEFAULT_SIGMA_MS = 1.0;
// NUL, other C0 controls except tab/CR/LF, DEL, and U+FFFD (what a UTF-8 decoder makes of invalid bytes).
const NOT_TEXT = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f\ufffd]/;

export function createPickParser(options: PickParserOptions = {}): PickParser {
  const maxErrors = options.maxErrors ?? 100;
  const maxRows = options.maxRows ?? MAX_PICK_ROWS;
  const maxChars = options.maxChars ?? MAX_PICK_FILE_BYTES;

  const errors: PickError[] = [];
  const picks: Pick[] = [];
  const tracker = new PickSetTracker();
  let carry = '';
  let chars = 0;
  let lineNo = 0;
  let rows = 0;
  let sawContent = false;
  let header: { index: ColumnIndex; fieldCount: number } | null = null;
  let stopped = false;
  let finished = false;

  const fail = (e: PickError): void => {
    if (errors.length >= maxErrors) return;
    errors.push(e);
    if (errors.length === maxErrors) {
      errors.push({ line: null, column: null, message: `stopped after ${maxErrors} errors; fix these and upload again` });
      stopped = true;
    }
  };
  const stop = (e: PickError): void => {
    errors.push(e);
    stopped = true;
  };

  function handleLine(raw: string): void {
    lineNo++;
    const text = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
    if (NOT_TEXT.test(text)) {
      const kind = lineNo === 1 ? notTextKind(text) : null;
      stop({ line: lineNo, column: null, message: kind ? `the file is ${kind}, not a pick file (CSV text)` : 'the file is not CSV text (binary or non-UTF-8 bytes found)' });
      return;
    }
    const trimmed = text.trim();
    if (trimmed === '' || trimmed.startsWith('#')) return;
    sawContent = true;
    if (!header) {
      const h = readHeader(splitCsvLine(text), lineNo);
      if ('errors' in h) {
        h.errors.forEach(fail);
        stopped = true; // rows cannot be read without a header
      } else header = h;
      return;
    }
    if (++rows > maxRows) {
      stop({ line: lineNo, column: null, message: `more than ${maxRows.toLocaleString('en-US')} pick rows; split the file` });
      return;
    }
    readRow(splitCsvLine(text), header);
  }

  function readRow(fields: string[], h: { index: ColumnIndex; fieldCount: number }): void {
    if (fields.length !== h.fieldCount) {
      fail({ line: lineNo, column: null, message: `expected ${h.fieldCount} fields as in the header, found ${fields.length}` });
      return;
    }
    const before = errors.length;
    const ix = h.index;
    const shotId = ix.shot_id === -1 ? '' : fields[ix.shot_id].trim();
    if (shotId === '') fail({ line: lineNo, column: 'shot_id', message: 'is empty' });
    const sourceX = readNumber(fields, ix, 'source_x', false, lineNo, fail);
    const sourceZ = readNumber(fields, ix, 'source_z', true, lineNo, fail);
    const receiverX = readNumber(fields, ix, 'receiver_x', false, lineNo, fail);
    const receiverZ = readNumber(fields, ix, 'receiver_z', true, lineNo, fail);
    const timeMs = readNumber(fields, ix, 'time_ms', false, lineNo, fail);
    const sigmaMs = readNumber(fields, ix, 'sigma_ms', true, lineNo, fail);
    if (timeMs !== null && timeMs < 0) fail({ line: lineNo, column: 'time_ms', message: `${timeMs} is negative; a travel time must be > 0` });
    if (sigmaMs !== null && sigmaMs <= 0) fail({ line: lineNo, column: 'sigma_ms', message: `${sigmaMs} must be > 0 (or empty for ${DEFAULT_SIGMA_MS} ms)` });
    // Plausible ranges (shared/limits.ts): junk such as 1e308 is refused here, not found late as NaN.
    checkRange(sourceX, X_RANGE, 'source_x', lineNo, fail);
    checkRange(sourceZ, Z_RANGE, 'source_z', lineNo, fail);
    checkRange(receiverX, X_RANGE, 'receiver_x', lineNo, fail);
    checkRange(receiverZ, Z_RANGE, 'receiver_z', lineNo, fail);
    if (timeMs !== null && timeMs >= 0) checkRange(timeMs, TIME_MS_RANGE, 'time_ms', lineNo, fail);
    if (sigmaMs !== null && sigmaMs > 0) checkRange(sigmaMs, SIGMA_MS_RANGE, 'sigma_ms', lineNo, fail);
    if (errors.length > before || sourceX === null || receiverX === null || timeMs === null) return;

    const pick: Pick = {
      line: lineNo,
      shotId,
      sourceX,
      sourceZ,
      receiverX,
      receiverZ,
      time: msToS(timeMs),
      sigma: msToS(sigmaMs ?? DEFAULT_SIGMA_MS),
    };
    if (timeMs === 0 && !atSource(pick)) {
      fail({ line: lineNo, column: 'time_ms', message: 'is 0, which is allowed only for a pick at the source position itself' });
    }
    const conflicts = tracker.add(pick);
    for (let i = 0; i < conflicts.length; i++) fail({ line: lineNo, column: conflicts[i].column, message: conflicts[i].message });
    if (errors.length === 0) picks.push(pick);
  }

  return {
    push(chunk: string): void {
      if (finished) throw new Error('pick parser: push() after finish()');
      if (stopped) return;
      if (chars === 0 && chunk.charCodeAt(0) === 0xfeff) chunk = chunk.slice(1); // byte-order mark
      chars += chunk.length;
      if (chars > maxChars) {
        stop({ line: null, column: null, message: `the file is larger than ${sizeText(maxChars)}; split it` });
        return;
      }
      let text = carry + chunk;
      let start = 0;
      let nl: number;
      while (!stopped && (nl = text.indexOf('\n', start)) !== -1) {
        handleLine(text.slice(start, nl));
        start = nl + 1;
      }
      carry = stopped ? '' : text.slice(start);
      text = '';
    },

    finish(): PickParseResult {
      if (finished) throw new Error('pick parser: finish() called twice');
      finished = true;
      if (!stopped && carry !== '') handleLine(carry);
      carry = '';
      if (errors.length === 0) {
        if (!sawContent) errors.push({ line: null, column: null, message: 'the file is empty (no header, no picks)' });
        else if (rows === 0) errors.push({ line: null, column: null, message: 'the file has a header but no picks' });
      }
      if (errors.length) return { ok: false, errors };
      return { ok: true, picks, shots: tracker.summaries() };
    },
  };
}

/** One numeric field; null when empty (reported if required) or not a number (reported). Module-level: no per-row closures. */
function readNumber(
  fields: string[],
  index: ColumnIndex,
  column: PickColumn,
  optional: boolean,
  line: number,
  fail: (e: PickError) => void,
): number | null {
  const t = index[column] === -1 ? '' : fields[index[column]].trim();
  if (t === '') {
    if (!optional) fail({ line, column, message: 'is empty; a number is required' });
    return null;
  }
  const n = parseDecimal(t);
  if (n === null) fail({ line, column, message: `${JSON.stringify(clip(t))} is not a number` });
  return n;
}

/** Reports a number outside its plausible range (null: absent or already reported). */
function checkRange(value: number | null, range: NumberRange, column: PickColumn, line: number, fail: (e: PickError) => void): void {
  if (value === null) return;
  const problem = outOfRange(value, range);
  if (problem) fail({ line, column, message: problem });
}

const sizeText = (n: number): string => (n >= 1048576 ? `${+(n / 1048576).toFixed(1)} MB` : `${n} characters`);

/** Whole text at once (tests, small previews). */
export function parsePickText(text: string, options?: PickParserOptions): PickParseResult {
  const parser = createPickParser(options);
  parser.push(text);
  return parser.finish();
}

/** `line 14, time_ms: "abc" is not a number` (FORMATS.md §2). */
export function formatPickError(e: PickError): string {
  if (e.line !== null && e.column !== null) return `line ${e.line}, ${e.column}: ${e.message}`;
  if (e.line !== null) return `line ${e.line}: ${e.message}`;
  if (e.column !== null) return `${e.column}: ${e.message}`;
  return e.message;
}
