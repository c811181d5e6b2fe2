import { describe, expect, it } from 'vitest';
import { numberCell, RESIDUAL_CSV_HEADER, residualCsvName, residualsToCsv } from '../../../src/components/run/table/residualCsv';
import { row } from './fixtures';

/**
 * Reference: RFC 4180 (Shafranovich, "Common Format and MIME Type for Comma-Separated Values (CSV)
 * Files", 2005): records end in CRLF; a field holding a comma, double quote or line break is enclosed
 * in double quotes, and a double quote inside it is written twice. The parser below follows the
 * RFC's grammar, independently of the writer, and reads the export back.
 */
function parseRfc4180(text: string): string[][] {
  const records: string[][] = [];
  let field = '';
  let record: string[] = [];
  let i = 0;
  let quoted = false;
  while (i < text.length) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') (field += '"'), (i += 2);
      else if (ch === '"') (quoted = false), i++;
      else (field += ch), i++;
    } else if (ch === '"' && field === '') (quoted = true), i++;
    else if (ch === ',') record.push(field), (field = ''), i++;
    else if (ch === '\r' && text[i + 1] === '\n') record.push(field), records.push(record), (record = []), (field = ''), (i += 2);
    else (field += ch), i++;
  }
  if (field !== '' || record.length) record.push(field), records.push(record);
  return records;
}

describe('residualsToCsv', () => {
  it('writes the header and one CRLF-terminated record per pick', () => {
    const csv = residualsToCsv([row({ shotId: 'S1', receiverX: 2.5, observedMs: 12.76, computedMs: 12.7583604 }), row({ shotId: 'S2', pickIndex: 1 })]);
    expect(csv.endsWith('\r\n')).toBe(true);
    expect(csv.split('\r\n')).toHaveLength(4); // header, two rows, empty after the final CRLF
    const records = parseRfc4180(csv);
    expect(records[0]).toEqual([...RESIDUAL_CSV_HEADER]);
    expect(records[1]!.slice(0, 6)).toEqual(['S1', '2.5', '100', '12.76', '12.7584', '0.0016']);
  });

  it('quotes shot ids with commas, quotes and line breaks, and reads them back unchanged', () => {
    const awkward = ['S,1', 'say "hi"', 'two\r\nlines'];
    const csv = residualsToCsv(awkward.map((shotId, pickIndex) => row({ shotId, pickIndex })));
    expect(csv).toContain('"S,1"');
    expect(csv).toContain('"say ""hi"""');
    const records = parseRfc4180(csv);
    expect(records.slice(1).map((r) => r[0])).toEqual(awkward);
    expect(records.slice(1).every((r) => r.length === RESIDUAL_CSV_HEADER.length)).toBe(true);
  });

  it('defuses text a spreadsheet would run as a formula, but leaves plain numbers alone (OWASP, "CSV Injection")', () => {
    const csv = residualsToCsv([row({ shotId: '=HYPERLINK("x")' }), row({ shotId: '-12', pickIndex: 1 })]);
    const records = parseRfc4180(csv);
    expect(records[1]![0]).toBe('\'=HYPERLINK("x")');
    expect(records[2]![0]).toBe('-12');
  });

  it('writes flags and the exclusion plainly', () => {
    const records = parseRfc4180(residualsToCsv([row({ excluded: true, flags: ['excluded', 'beyond_3_sigma'] })]));
    expect(records[1]!.slice(-2)).toEqual(['yes', 'excluded;beyond_3_sigma']);
  });
});

describe('numberCell', () => {
  it('trims trailing zeros and never writes NaN or -0', () => {
    expect(numberCell(12.5, 3)).toBe('12.5');
    expect(numberCell(-0.00001, 4)).toBe('0');
    expect(numberCell(Number.NaN, 4)).toBe('');
    expect(numberCell(Number.POSITIVE_INFINITY, 4)).toBe('');
  });
});

describe('residualCsvName', () => {
  it('names the line and the run', () => {
    expect(residualCsvName('TQ-L1', 'cb2a8b3a-d68a-4791')).toBe('tq-l1-residuals-run-cb2a8b3a.csv');
    expect(residualCsvName('***', 'abc')).toBe('line-residuals-run-abc.csv');
  });
});
