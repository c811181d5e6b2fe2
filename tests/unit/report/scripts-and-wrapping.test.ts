/**
 * Issue 16: names in Cyrillic, Greek and Chinese print as those characters (not as empty boxes), and
 * a shot id too long for its table column wraps inside the column. Read back with poppler
 * (pdftotext, pdffonts), the way a reader's tools see the PDF.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { smallReportInput } from '../../../fixtures/report/small';
import { renderReportPdf } from '../../../worker/report/render';
import { CONTENT } from '../../../worker/report/style';
import { pageTexts, pdfFonts, wordBoxes } from './poppler';

const dir = mkdtempSync(join(tmpdir(), 'timefield-report-scripts-'));

async function write(name: string, input: ReturnType<typeof smallReportInput>): Promise<string> {
  const path = join(dir, `${name}.pdf`);
  writeFileSync(path, await renderReportPdf(input));
  return path;
}

describe('report text outside Latin and long identifiers', () => {
  it('prints a project name in Cyrillic, Greek and Chinese as those characters, with the fallback font embedded', async () => {
    // Invented names: "Site North", "Delta", "seismic line" in the three scripts.
    const name = 'Участок Север · Δέλτα · 地震测线';
    const base = smallReportInput();
    const path = await write('scripts', smallReportInput({ project: { ...base.project, name }, consultancy: 'Геофизика Δ 勘探 (fictional)' }));
    const text = pageTexts(path).join('\n');
    expect(text).toContain(name);
    expect(text).toContain('Геофизика Δ 勘探 (fictional)');
    const fonts = pdfFonts(path);
    expect(fonts.some((f) => f.name.includes('NotoSansSC') && f.embedded)).toBe(true);
    expect(fonts.some((f) => f.name.includes('SourceSans3'))).toBe(true);
  });

  it('wraps a long shot id inside its column of the misfit table instead of running into the next', async () => {
    const longId = 'L7-SHOT-0042-REPEAT-AFTER-RAIN';
    const base = smallReportInput();
    const byShot = base.run.stats.by_shot.map((b, i) => (i === 1 ? { ...b, shotId: longId } : b));
    const path = await write('long-shot-id', smallReportInput({ run: { ...base.run, stats: { ...base.run.stats, by_shot: byShot } } }));
    const pages = pageTexts(path);
    const page = pages.findIndex((p) => p.includes('Misfit by shot')) + 1;
    expect(page).toBeGreaterThan(0);
    // The pieces of the id: from the word that starts it, the words of the Shot column that continue it.
    const words = wordBoxes(path, page);
    const first = words.findIndex((w) => w.text.startsWith('L7-'));
    expect(first).toBeGreaterThanOrEqual(0);
    const pieces = [words[first]];
    for (const w of words.slice(first + 1)) {
      const sofar = pieces.map((p) => p.text).join('');
      if (sofar.length >= longId.length) break;
      if (w.xMin < CONTENT.left + 70 && longId.startsWith(sofar + w.text)) pieces.push(w);
    }
    expect(pieces.map((w) => w.text).join('')).toBe(longId);
    // "Shot" is the first column, 70 pt wide (worker/report/misfit.ts), at the left edge of the text.
    for (const w of pieces) expect(w.xMax).toBeLessThanOrEqual(CONTENT.left + 70);
    expect(pieces.length).toBeGreaterThan(1);
  });
});
