/**
 * The PDF summary read back with poppler-utils (pdftotext, pdfinfo, pdffonts, pdfimages, pdftoppm):
 * every section heading and figure caption is there, and the numbers a reader relies on are the
 * ones computed independently here from the input rows and the model (RMS misfit, χ² per datum,
 * grid spacing, scheme order, the iso-velocity depth table from shared/model/iso-depth).
 * Expected strings are written out literally, not taken from the renderer's own modules.
 */
import { mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel } from '../../../shared/model';
import { isoVelocityDepth } from '../../../shared/model/iso-depth';
import { SMALL_MODEL, smallReportInput } from '../../../fixtures/report/small';
import { renderReportPdf } from '../../../worker/report/render';
import type { ReportInput } from '../../../worker/report/types';
import { normalisedLines, pageTexts, pdfFonts, pdfImages, pdfInfo, readPpm, renderPage } from './poppler';

const dir = mkdtempSync(join(tmpdir(), 'timefield-report-'));
let input: ReportInput;
let pdfPath: string;
let pdf: Buffer;
let pages: string[];
let lines: string[];
let all: string;
/** The text as one flow (wrapped lines joined by a space), for captions and sentences. */
let flow: string;

beforeAll(async () => {
  input = smallReportInput();
  pdf = await renderReportPdf(input);
  pdfPath = join(dir, 'report.pdf');
  writeFileSync(pdfPath, pdf);
  pages = pageTexts(pdfPath);
  lines = normalisedLines(pages.join('\n'));
  all = lines.join('\n');
  flow = lines.join(' ');
}, 120_000);

const pageWith = (needle: string): number => pages.findIndex((p) => normalisedLines(p).join('\n').includes(needle)) + 1;

describe('PDF summary: document', () => {
  it('is A4 portrait, with Source Sans 3 embedded and no other font', () => {
    expect(pdf.subarray(0, 5).toString('ascii')).toBe('%PDF-');
    const info = pdfInfo(pdfPath);
    expect(info['Page size']).toMatch(/^595\.2\d? x 841\.8\d? pts \(A4\)$/);
    const fonts = pdfFonts(pdfPath);
    expect(fonts.length).toBeGreaterThanOrEqual(2);
    for (const f of fonts) {
      expect(f.name).toMatch(/^[A-Z]{6}\+SourceSans3-/);
      expect(f.embedded).toBe(true);
    }
  });

  it('numbers every page "page N of M" beside the project, line and report status', () => {
    const n = Number(pdfInfo(pdfPath).Pages);
    expect(pages).toHaveLength(n);
    expect(n).toBeGreaterThanOrEqual(7);
    pages.forEach((p, i) => {
      const text = normalisedLines(p).join('\n');
      expect(text).toContain(`page ${i + 1} of ${n}`);
      expect(text).toContain('Brackenhurst cutting widening · line BH-2 · report draft');
    });
  });

  it('has a cover with project, site, client, line, date, people and status', () => {
    const cover = normalisedLines(pages[0]).join('\n');
    for (const s of [
      'Ashgrove Ground Imaging (fictional)',
      'Seismic refraction summary',
      'Project Brackenhurst cutting widening',
      'Site Brackenhurst, cutting chainage 1+200 (fictional site)',
      'Client Fellside Highways Partnership (fictional)',
      'Survey line BH-2',
      'Date 2025-05-14',
      'Prepared by Imogen Tarrant',
      'Reviewed by not yet reviewed',
      'Report status draft',
    ]) expect(cover).toContain(s);
  });

  it('has every section heading, in order, each once', () => {
    const headings = ['1 The survey', '2 Velocity section', '3 Depth to the 2000 m/s surface', '4 Boreholes and ties', '5 Travel-time curves', '6 Misfit', '7 Method statement', '8 Limitations and cautions'];
    const at = headings.map((h) => lines.indexOf(h));
    for (const [i, h] of headings.entries()) expect(at[i], h).toBeGreaterThan(0);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
  });

  it('has every figure and table caption, numbered in order', () => {
    const figures = [
      'Figure 1. Station and shot layout along the line',
      'Figure 2. Velocity section with the wavefronts of shot B every',
      'Figure 3. Depth below the ground surface to the first point where the velocity reaches 2000 m/s',
      'Figure 4. Travel-time curves: observed picks',
      'Figure 5. Residuals (observed - computed, ms) by shot (rows) and receiver position (columns)', // minus read as '-' after normalisation
    ];
    const tables = ['Table 1. Shots:', 'Table 2. Layers of the model', 'Table 3. Depth to the 2000 m/s surface at the stations', 'Table 4. Misfit by shot'];
    for (const list of [figures, tables]) {
      let last = -1;
      for (const c of list) {
        const i = flow.indexOf(c);
        expect(i, c).toBeGreaterThan(last);
        expect(flow.indexOf(c, i + 1), `${c} twice`).toBe(-1);
        last = i;
      }
    }
    expect(flow).not.toMatch(/Figure 6\.|Table 5\./);
  });
});

describe('PDF summary: numbers', () => {
  it('prints the run misfit as computed from the residual rows (RMS, χ², max |r|, picks)', () => {
    // RMS = sqrt(Σr²/N); χ² per datum = Σ(r/σ)²/N over picks not excluded (Bevington & Robinson 2003,
    // "Data Reduction and Error Analysis for the Physical Sciences", 3rd ed., χ² divided by N).
    const used = input.residuals.filter((r) => !r.excluded);
    const rms = Math.sqrt(used.reduce((s, r) => s + r.residualMs ** 2, 0) / used.length);
    const chi2 = used.reduce((s, r) => s + (r.residualMs / r.sigmaMs) ** 2, 0) / used.length;
    const maxAbs = Math.max(...used.map((r) => Math.abs(r.residualMs)));
    expect(lines).toContain(`RMS misfit ${rms.toFixed(2)} ms`);
    expect(lines).toContain(`χ² per datum ${chi2.toFixed(2)}`);
    expect(lines).toContain(`Largest |residual| ${maxAbs.toFixed(2)} ms`);
    expect(lines).toContain(`Picks used ${used.length}`);
    expect(lines).toContain(`Picks excluded ${input.residuals.length - used.length}`);
    expect(input.residuals.length - used.length).toBeGreaterThan(0); // the fixture has an excluded pick to leave out
  });

  it('prints the misfit of every shot', () => {
    for (const shot of input.shots) {
      const used = input.residuals.filter((r) => r.shotId === shot.shotId && !r.excluded);
      const rms = Math.sqrt(used.reduce((s, r) => s + r.residualMs ** 2, 0) / used.length);
      const chi2 = used.reduce((s, r) => s + (r.residualMs / r.sigmaMs) ** 2, 0) / used.length;
      expect(lines.some((l) => l.startsWith(`${shot.shotId} ${used.length} ${rms.toFixed(2)} ${chi2.toFixed(2)} `)), shot.shotId).toBe(true);
    }
  });

  it('states grid spacing and size, scheme order, solver, pick uncertainty, model version and pick-set revision', () => {
    const g = SMALL_MODEL.grid;
    expect(flow).toContain(`dx = ${g.dx} m, dz = ${g.dz} m; ${g.nx} × ${g.nz} nodes`);
    expect(flow).toContain('Scheme order second order');
    expect(flow).toContain('fast marching eikonal solver');
    expect(flow).toContain('Software Timefield');
    expect(flow).toContain('Pick uncertainty σ 0.5 ms for every pick');
    expect(flow).toContain('"BH-2 three layers", version 3');
    expect(flow).toContain('Pick set bh-2.picks.csv, revision 2');
    expect(flow).toContain('|grad T| = 1/v');
  });

  it('tabulates the depth to the iso-velocity surface at every station, as shared/model/iso-depth computes it', () => {
    const parsed = parseModelFile(SMALL_MODEL);
    if (!parsed.ok) throw new Error('fixture model');
    const model = rasteriseModel(parsed.model);
    const tablePage = pageWith('Table 3. Depth to the 2000 m/s surface');
    const rows = normalisedLines(pages.slice(tablePage - 1).join('\n'));
    let reached = 0;
    let missed = 0;
    for (const s of input.stations) {
      const r = isoVelocityDepth(model, 2000, s.x);
      const start = `${s.station} ${s.x.toFixed(2)} ${r.groundZ.toFixed(2)} `;
      const want = r.depth === null ? `${start}not reached within the model —` : `${start}${r.depth.toFixed(1)} ${r.elevation!.toFixed(1)}`;
      expect(rows, `station ${s.station}`).toContain(want);
      if (r.depth === null) missed++;
      else reached++;
    }
    // The fixture's rock dips out of the model: both cases are exercised.
    expect(reached).toBeGreaterThan(3);
    expect(missed).toBeGreaterThan(0);
  });

  it('lists the shots with position, elevation and number of picks', () => {
    for (const s of input.shots) {
      const picks = input.residuals.filter((r) => r.shotId === s.shotId).length;
      const excluded = input.residuals.filter((r) => r.shotId === s.shotId && r.excluded).length;
      expect(lines).toContain(`${s.shotId} ${s.sourceX.toFixed(2)} ${s.sourceZ.toFixed(2)} ${picks} ${excluded}`);
    }
  });

  it('carries the cautions', () => {
    for (const s of ['Forward model only.', 'Non-uniqueness.', 'Hidden layers and velocity inversions.', 'A layer slower than the one above it', 'Resolution.', 'station spacing (5 m)', 'boreholes, trial pits', 'qualified and experienced professional', 'Local codes, standards']) {
      expect(flow, s).toContain(s);
    }
    expect(pages[0]).toContain('not been approved for issue');
  });
});

describe('PDF summary: drawing', () => {
  it('uses raster images only for the velocity section and the residual heatmap; curves and contours are vector', () => {
    const images = pdfImages(pdfPath);
    const g = SMALL_MODEL.grid;
    expect(images).toHaveLength(2);
    expect(images[0]).toMatchObject({ page: pageWith('2 Velocity section'), width: g.nx, height: g.nz });
    expect(images[1].page).toBe(pageWith('6 Misfit'));
    expect(images.some((i) => i.page === pageWith('5 Travel-time curves'))).toBe(false);
  });

  it('renders page 1 and the velocity section page to PNG, and they are not blank', () => {
    const sectionPage = pageWith('2 Velocity section');
    for (const page of [1, sectionPage]) {
      const png = renderPage(pdfPath, page, join(dir, `page-${page}`), 'png');
      expect(readFileSync(png).subarray(1, 4).toString('ascii')).toBe('PNG');
      expect(statSync(png).size).toBeGreaterThan(8_000);
    }
    // Pixels: the cover is mostly paper with some type; the section page shows slow (sand) and
    // fast (blue) ground from the velocity colour scale.
    const cover = readPpm(renderPage(pdfPath, 1, join(dir, 'cover'), 'ppm'));
    // A4 is 595.28 × 841.89 pt = 8.27 × 11.69 in: at 60 dpi 496.07 × 701.6 pixels, rounded up by pdftoppm.
    expect([cover.width, cover.height]).toEqual([Math.ceil((595.28 / 72) * 60), Math.ceil((841.89 / 72) * 60)]);
    const ink = share(cover.rgb, (r, g, b) => r + g + b < 600);
    expect(ink).toBeGreaterThan(0.005);
    expect(ink).toBeLessThan(0.2);
    const section = readPpm(renderPage(pdfPath, sectionPage, join(dir, 'section'), 'ppm'));
    expect(share(section.rgb, (r, g, b) => b > r + 40)).toBeGreaterThan(0.01); // fast ground: blue
    expect(share(section.rgb, (r, g, b) => r > b + 25 && g > b + 15 && r > 200)).toBeGreaterThan(0.01); // slow ground: sand
  });

  it('gives the same bytes for the same input', async () => {
    expect((await renderReportPdf(input)).equals(pdf)).toBe(true);
  }, 120_000);
});

function share(rgb: Uint8Array, test: (r: number, g: number, b: number) => boolean): number {
  let n = 0;
  for (let i = 0; i < rgb.length; i += 3) if (test(rgb[i], rgb[i + 1], rgb[i + 2])) n++;
  return n / (rgb.length / 3);
}
