/** Pick-file parser against FORMATS.md §2: good files, every bad-file rule, chunked feeding, limits. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { createPickParser, formatPickError, parsePickText, type PickParseResult } from '../../../shared/picks';

const fixtureBytes = (name: string): Buffer => readFileSync(new URL(`../../../fixtures/picks/${name}`, import.meta.url));
const fixture = (name: string): string => fixtureBytes(name).toString('utf8');
const errorsOf = (r: PickParseResult): string[] => {
  if (r.ok) throw new Error('expected the file to be rejected');
  return r.errors.map(formatPickError);
};

const HEADER = 'shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms';

describe('parsePickText: good files', () => {
  it('reads the Line A fixture: 3 shots × 25 picks, SI inside, empty z → null, default sigma 1 ms', () => {
    const r = parsePickText(fixture('line-a.picks.csv'));
    if (!r.ok) throw new Error(r.errors.map(formatPickError).join('\n'));
    expect(r.picks).toHaveLength(75);
    expect(r.shots).toEqual([
      { shotId: 'A01', sourceX: 0, sourceZ: null, picks: 25 },
      { shotId: 'A02', sourceX: 60, sourceZ: null, picks: 25 },
      { shotId: 'A03', sourceX: 120, sourceZ: null, picks: 25 },
    ]);
    // line 5: A01,0.0,,0.0,,0.0,0.2 (the pick at the source, time 0); line 6: A01,0.0,,5.0,,8.3,0.5
    expect(r.picks[0]).toEqual({ line: 5, shotId: 'A01', sourceX: 0, sourceZ: null, receiverX: 0, receiverZ: null, time: 0, sigma: 0.0002 });
    expect(r.picks[1]).toEqual({ line: 6, shotId: 'A01', sourceX: 0, sourceZ: null, receiverX: 5, receiverZ: null, time: 0.0083, sigma: 0.0005 });
    const empty = r.picks.find((p) => p.shotId === 'A02' && p.receiverX === 100)!;
    expect(empty.sigma).toBe(0.001);
  });

  it('accepts free column order, mixed-case names, CRLF, a BOM, quotes, comments and blank lines', () => {
    const text = '\ufeff# exported 2031-04-02\r\n\r\nTIME_MS,Receiver_X,shot_id,Source_X,receiver_z\r\n12.5,10,"S 1",0,98.25\r\n  # a comment\r\n25.0,20,"S 1",0,\r\n';
    const r = parsePickText(text);
    if (!r.ok) throw new Error(r.errors.map(formatPickError).join('\n'));
    expect(r.picks.map((p) => [p.line, p.shotId, p.receiverX, p.receiverZ, p.time])).toEqual([
      [4, 'S 1', 10, 98.25, 0.0125],
      [6, 'S 1', 20, null, 0.025],
    ]);
  });

  it('allows time 0 at the source position only', () => {
    const ok = parsePickText(`${HEADER}\nS1,10,,10,,0,\n`);
    expect(ok.ok).toBe(true);
    expect(errorsOf(parsePickText(`${HEADER}\nS1,10,,12,,0,\n`))).toEqual([
      'line 2, time_ms: is 0, which is allowed only for a pick at the source position itself',
    ]);
  });

  it('gives the same result however the text is cut into chunks', () => {
    const text = fixture('line-a.picks.csv');
    const whole = parsePickText(text);
    for (const size of [1, 7, 64, 1000]) {
      const parser = createPickParser();
      for (let i = 0; i < text.length; i += size) parser.push(text.slice(i, i + size));
      expect(parser.finish()).toEqual(whole);
    }
  });
});

describe('parsePickText: bad files are rejected whole with line and column', () => {
  it('non-numeric time', () => {
    expect(errorsOf(parsePickText(fixture('non-numeric.picks.csv')))).toEqual(['line 5, time_ms: "abc" is not a number']);
  });

  it('negative time', () => {
    expect(errorsOf(parsePickText(fixture('negative-time.picks.csv')))).toEqual([
      'line 4, time_ms: -1.2 is negative; a travel time must be > 0',
    ]);
  });

  it('a shot with two source positions', () => {
    expect(errorsOf(parsePickText(fixture('shot-two-positions.picks.csv')))).toEqual([
      'line 5, source_x: shot A02 has source_x = 60 on line 3 but 62.5 here; all picks of a shot share one source position',
    ]);
  });

  it('duplicate pick', () => {
    expect(errorsOf(parsePickText(fixture('duplicate-pick.picks.csv')))).toEqual([
      'line 5, receiver_x: shot A01 already has a pick at receiver_x = 10, receiver_z on the surface (line 4); duplicate pick',
    ]);
  });

  it('bad header: unknown and missing columns', () => {
    expect(errorsOf(parsePickText(fixture('bad-header.picks.csv')))).toEqual([
      'line 2, shot: unknown column; expected some of shot_id, source_x, source_z, receiver_x, receiver_z, time_ms, sigma_ms',
      'line 2, tiem_ms: unknown column; expected some of shot_id, source_x, source_z, receiver_x, receiver_z, time_ms, sigma_ms',
      'line 2, shot_id: required column is missing from the header',
      'line 2, time_ms: required column is missing from the header',
    ]);
  });

  it('no header at all (data on the first line)', () => {
    expect(errorsOf(parsePickText('S1,0,,5,,6.7,\n'))[0]).toMatch(/^line 1: the first line that is not a comment must be the header/);
  });

  it('empty file, comments only, header only', () => {
    expect(errorsOf(parsePickText(fixture('empty.picks.csv')))).toEqual(['the file is empty (no header, no picks)']);
    expect(errorsOf(parsePickText('# nothing yet\n\n'))).toEqual(['the file is empty (no header, no picks)']);
    expect(errorsOf(parsePickText(fixture('header-only.picks.csv')))).toEqual(['the file has a header but no picks']);
  });

  it('binary garbage stops at once with one error', () => {
    const errors = errorsOf(parsePickText(fixture('binary.picks.csv')));
    expect(errors).toHaveLength(1);
    // The fixture starts with a ZIP local file header (50 4B 03 04): named for what it is.
    expect(errors[0]).toBe('line 1: the file is a ZIP archive (for example an .xlsx or .docx file), not a pick file (CSV text)');
  });

  it('wrong field count, empty required values, bad sigma, duplicate header column', () => {
    expect(errorsOf(parsePickText(`${HEADER}\nS1,0,,5,,6.7\n,0,,5,,,0\n`))).toEqual([
      'line 2: expected 7 fields as in the header, found 6',
      'line 3, shot_id: is empty',
      'line 3, time_ms: is empty; a number is required',
      'line 3, sigma_ms: 0 must be > 0 (or empty for 1 ms)',
    ]);
    expect(errorsOf(parsePickText('shot_id,source_x,receiver_x,time_ms,Time_MS\n'))).toEqual([
      'line 1, time_ms: column appears twice in the header',
    ]);
  });

  it.each(['0x1A', 'Infinity', '1,5', '1e999', '--2', '.'])('rejects %s as a number', (text) => {
    const r = parsePickText(`shot_id;source_x,receiver_x,time_ms\n`.replace(';', ',') + `S1,0,5,"${text}"\n`);
    expect(errorsOf(r)).toEqual([`line 2, time_ms: ${JSON.stringify(text)} is not a number`]);
  });

  it('collects at most 100 errors, then stops', () => {
    const rows = Array.from({ length: 500 }, (_, i) => `S1,0,,${i},,x,`).join('\n');
    const errors = errorsOf(parsePickText(`${HEADER}\n${rows}\n`));
    expect(errors).toHaveLength(101);
    expect(errors[99]).toBe('line 101, time_ms: "x" is not a number');
    expect(errors[100]).toMatch(/stopped after 100 errors/);
  });

  it('enforces the row limit with a clear message', () => {
    const rows = Array.from({ length: 6 }, (_, i) => `S1,0,,${i + 1},,${i + 1},`).join('\n');
    expect(errorsOf(parsePickText(`${HEADER}\n${rows}\n`, { maxRows: 5 }))).toEqual(['line 7: more than 5 pick rows; split the file']);
  });

  it('enforces the size limit', () => {
    expect(errorsOf(parsePickText(`${HEADER}\n`.repeat(10), { maxChars: 100 }))).toEqual(['the file is larger than 100 characters; split it']);
  });
});
