/**
 * A file that is not text, dropped where a CSV or JSON file is wanted, is named for what it is by its
 * first bytes — the formats' published signatures: PNG (ISO/IEC 15948, 89 50 4E 47 0D 0A 1A 0A), PDF
 * ("%PDF-", ISO 32000), ZIP local file header (50 4B 03 04, PKWARE APPNOTE), GIF ("GIF89a"), SEG-2
 * (file descriptor block 0x3A55, Pullan 1990) — and every parser refuses it whole at line 1.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { notTextKind } from '../../../shared/files/not-text';
import { parsePickText } from '../../../shared/picks/parser';
import { parseStationCsv } from '../../../shared/stations';
import { parseBoreholeCsv } from '../../../shared/boreholes';
import { parseGridCsv } from '../../../shared/model/edit/grid-csv';

// As the server and the pages read an upload: UTF-8, undecodable bytes replaced.
const decode = (bytes: number[] | Uint8Array): string => new TextDecoder('utf-8', { fatal: false }).decode(Uint8Array.from(bytes));
const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1];

describe('files that are not text', () => {
  it('are named by their signature', () => {
    expect(notTextKind(decode(PNG))).toBe('a PNG image');
    expect(notTextKind(decode([...Buffer.from('%PDF-1.7\n'), 0xe2, 0xe3, 0xcf, 0xd3, 0x0a]))).toBe('a PDF document');
    expect(notTextKind(decode([0x50, 0x4b, 0x03, 0x04, 0x14, 0, 0x06, 0]))).toBe('a ZIP archive (for example an .xlsx or .docx file)');
    expect(notTextKind(decode([...Buffer.from('GIF89a'), 1, 0, 1, 0, 0x80, 0]))).toBe('a GIF image');
    expect(notTextKind(decode([0x55, 0x3a, 0x01, 0x00, 0x80, 0x00, 0x03, 0x00]))).toMatch(/^a SEG-2 shot record/);
    expect(notTextKind(decode([0x01, 0x02, 0x03, 0x04]))).toBe('a binary file');
  });

  it('text is text: CSV with tabs, CRLF and non-ASCII letters passes', () => {
    expect(notTextKind('station,x,z\r\n1,0,100\t\r\n2,2.5,100.1 # Øresund\r\n')).toBeNull();
    expect(notTextKind('{"format": "timefield-model/1"}')).toBeNull();
  });

  it('every file reader refuses a PNG at line 1 saying what it is', () => {
    const text = decode(PNG);
    const picks = parsePickText(text);
    expect(picks.ok).toBe(false);
    expect(!picks.ok && picks.errors[0]).toMatchObject({ line: 1, message: 'the file is a PNG image, not a pick file (CSV text)' });
    const stations = parseStationCsv(text);
    expect(!stations.ok && stations.issues[0]).toMatchObject({ line: 1, message: 'the file is a PNG image, not a station table (CSV text)' });
    const holes = parseBoreholeCsv(text);
    expect(!holes.ok && holes.issues[0]).toMatchObject({ line: 1, message: 'the file is a PNG image, not a borehole file (CSV text)' });
    const grid = parseGridCsv(text);
    expect(!grid.ok && grid.errors[0]).toMatchObject({ line: 1, message: 'the file is a PNG image, not a velocity grid (CSV text)' });
  });
});
