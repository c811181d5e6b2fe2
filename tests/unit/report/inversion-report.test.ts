/**
 * The PDF summary of an inversion, read back with poppler-utils, on the invented fixture (a survey
 * inverted by the engine, stored in fixtures/report/inversion-small.json): every section heading,
 * the convergence table and misfit computed here from the input rows, the settings and sources of
 * the method statement, the tomography limitations, and the figures (velocity section, residual
 * heatmap, two checkerboard panels). Expected strings are written out, not taken from the renderer.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { smallInversionReportInput } from '../../../fixtures/report/inversion';
import { renderInversionReportPdf } from '../../../worker/report/inversion/render';
import type { InversionReportInput } from '../../../worker/report/inversion/types';
import { normalisedLines, pageTexts, pdfFonts, pdfImages, pdfInfo } from './poppler';

const dir = mkdtempSync(join(tmpdir(), 'timefield-inversion-report-'));
let input: InversionReportInput;
let pdfPath: string;
let pdf: Buffer;
let pages: string[];
let lines: string[];
let flow: string;

beforeAll(async () => {
  input = smallInversionReportInput();
  pdf = await renderInversionReportPdf(input);
  pdfPath = join(dir, 'inversion.pdf');
  writeFileSync(pdfPath, pdf);
  pages = pageTexts(pdfPath);
  lines = normalisedLines(pages.join('\n'));
  flow = lines.join(' ');
}, 120_000);

const pageWith = (needle: string): number => pages.findIndex((p) => normalisedLines(p).join('\n').includes(needle)) + 1;

describe('inversion report: document', () => {
  it('is A4 with our embedded font only and "page N of M" on every page', () => {
    expect(pdfInfo(pdfPath)['Page size']).toMatch(/^595\.2\d? x 841\.8\d? pts \(A4\)$/);
    for (const f of pdfFonts(pdfPath)) {
      expect(f.name).toMatch(/^[A-Z]{6}\+SourceSans3-/);
      expect(f.embedded).toBe(true);
    }
    pages.forEach((p, i) => expect(normalisedLines(p).join('\n')).toContain(`page ${i + 1} of ${pages.length}`));
    expect(pdfInfo(pdfPath).Subject).toBe('Travel-time tomography, report rep-inv-1 (draft)');
  });

  it('has a cover saying it is a tomography result, with its provenance and the pointer to the cautions', () => {
    const cover = normalisedLines(pages[0]).join(' ');
    expect(cover).toContain('Velocity section of line SP-1 by travel-time tomography');
    expect(cover).toContain('Project Harrowby Mill spillway upgrade');
    expect(cover).toContain('has not been approved for issue');
    expect(cover).toContain('section 8, Limitations and cautions');
    expect(cover).toContain('inversion inv-sp1-1 (2026-03-17) of pick set sp-1.picks.csv revision 3; starting model: automatic 1-D gradient');
  });

  it('has every section heading, in order, each once', () => {
    const headings = [
      '1 Velocity section from the inversion',
      '2 Depth to the 2500 m/s surface',
      '3 Boreholes and ties',
      '4 Convergence',
      '5 Misfit of the final model',
      '6 Resolution: checkerboard test',
      '7 Method statement and settings',
      '8 Limitations and cautions',
    ];
    const at = headings.map((h) => lines.indexOf(h));
    for (const [i, h] of headings.entries()) {
      expect(at[i], h).toBeGreaterThan(0);
      expect(lines.lastIndexOf(h), `${h} twice`).toBe(at[i]);
    }
    expect([...at].sort((a, b) => a - b)).toEqual(at);
  });

  it('captions the section with the coverage mask, its threshold and the DOI line', () => {
    expect(flow).toContain('Figure 1. Velocity section from the inversion');
    expect(flow).toContain('Grey: ray coverage mask, nodes crossed by less than 1 m of ray in total');
    expect(flow).toContain('Dashed purple line (DOI): depth of investigation, the deepest ray in each column');
    expect(flow).toContain('the 2500 m/s contour tabulated in section 2');
  });
});

describe('inversion report: numbers', () => {
  it('prints one convergence row per iteration: χ² and RMS to two decimals, the smoothing weight (— for the start)', () => {
    const h = input.inversion.history;
    expect(h.length).toBeGreaterThan(3);
    expect(h[0].smoothing).toBeNull();
    for (const r of h) {
      // Weights to three significant figures: 3.125 prints as 3.13 (the schedule halves from 50).
      const w = r.smoothing === null ? '—' : String(Number(r.smoothing.toPrecision(3)));
      expect(lines, `iteration ${r.iteration}`).toContain(`${r.iteration} ${r.chi2.toFixed(2)} ${r.rmsMs.toFixed(2)} ${w}`);
    }
    const first = h[0];
    const last = h[h.length - 1];
    expect(flow).toContain(`The misfit fell from χ² ${first.chi2.toFixed(2)} (RMS ${first.rmsMs.toFixed(2)} ms) on the starting model to χ² ${last.chi2.toFixed(2)} (RMS ${last.rmsMs.toFixed(2)} ms) after ${last.iteration} iterations`);
    expect(input.inversion.stopReason).toBe('target-misfit');
    expect(flow).toContain('it stopped because χ² per datum reached the target range 0.9 to 1.1');
    expect(flow).toContain('Figure 2. Convergence: χ² per datum on a logarithmic scale, the target range 0.9 to 1.1 shaded');
  });

  it('prints the misfit of the final model as computed from the residual rows', () => {
    // RMS = sqrt(Σr²/N); χ² per datum = Σ(r/σ)²/N (Bevington & Robinson 2003, 3rd ed., χ² divided by N).
    const used = input.residuals.filter((r) => !r.excluded);
    const rms = Math.sqrt(used.reduce((s, r) => s + r.residualMs ** 2, 0) / used.length);
    const chi2 = used.reduce((s, r) => s + (r.residualMs / r.sigmaMs) ** 2, 0) / used.length;
    expect(lines).toContain(`RMS misfit ${rms.toFixed(2)} ms`);
    expect(lines).toContain(`χ² per datum ${chi2.toFixed(2)}`);
    expect(lines).toContain(`Picks used ${used.length}`);
    for (const shot of input.shots) {
      const rows = used.filter((r) => r.shotId === shot.shotId);
      const shotRms = Math.sqrt(rows.reduce((s, r) => s + r.residualMs ** 2, 0) / rows.length);
      expect(lines.some((l) => l.startsWith(`${shot.shotId.replace('\u2212', '-')} ${rows.length} ${shotRms.toFixed(2)} `)), shot.shotId).toBe(true);
    }
  });

  it('states every setting, the start and the method with its sources', () => {
    const s = input.inversion.settings;
    expect(flow).toContain('dx = 1 m, dz = 1 m; 73 × 27 nodes');
    expect(flow).toContain(`Starting model automatic: one velocity law v = v0 + k·depth below the ground surface`);
    const start = input.inversion.start as { v0: number; k: number };
    expect(flow).toContain(`v0 = ${Math.round(start.v0)} m/s, k = ${Number(start.k.toFixed(2))} m/s per m`);
    expect(flow).toContain(`Iterations ${input.inversion.history.at(-1)!.iteration} of at most ${s.maxIterations}`);
    expect(flow).toContain('Smoothing weight automatic: 50 for the first step');
    expect(flow).toContain(`Vertical weight ${s.verticalWeight} `);
    expect(flow).toContain(`Damping ${s.damping} `);
    expect(flow).toContain(`Velocity bounds ${s.vMin} to ${s.vMax} m/s`);
    expect(flow).toContain('Scheme order second order');
    expect(flow).toContain('Pick uncertainty σ 0.5 ms for every pick');
    expect(flow).toContain('Pick set sp-1.picks.csv, revision 3');
    expect(flow).toContain('slowness (1/velocity) at every ground node');
    expect(flow).toContain('ray-length sensitivity matrix');
    expect(flow).toContain('second differences of the slowness with separate horizontal and vertical weights');
    expect(flow).toContain('damping toward the starting model');
    expect(flow).toContain('solved with LSQR (Paige & Saunders 1982)');
    for (const source of ['Paige, C. C. and Saunders, M. A. (1982)', 'Zelt, C. A. and Barton, P. J. (1998)', 'Aster, R. C., Borchers, B. and Thurber, C. H. (2018)']) expect(flow).toContain(source);
  });

  it('reports the checkerboard test with its correlation', () => {
    const cb = input.inversion.checkerboard!;
    expect(flow).toContain(`squares ${cb.size} m across, alternately 7 % faster and slower`);
    expect(flow).toContain(`r = ${cb.correlation!.toFixed(2)}`);
    expect(flow).toContain('Figure 4. Checkerboard test');
  });

  it('carries the limitations of tomography next to the usual cautions', () => {
    for (const s of [
      'Smooths sharp contacts.',
      'appears as a velocity gradient spread over several metres',
      'Resolution falls with depth.',
      'Below the depth of investigation nothing is known',
      'Hidden layers and velocity inversions.',
      'A layer slower than the one above it',
      'Non-uniqueness.',
      'boreholes, trial pits',
      'qualified and experienced professional',
      'Local codes, standards',
    ]) expect(flow, s).toContain(s);
  });
});

describe('inversion report: drawing', () => {
  it('rasters the section (one pixel per node), the heatmap and the two checkerboard panels; nothing else', () => {
    const images = pdfImages(pdfPath);
    const g = input.inversion.grid;
    expect(images).toHaveLength(4);
    expect(images[0]).toMatchObject({ page: pageWith('1 Velocity section from the inversion'), width: g.nx, height: g.nz });
    expect(images[1].page).toBe(pageWith('5 Misfit of the final model'));
    expect(images.slice(2).map((i) => [i.page, i.width, i.height])).toEqual([
      [pageWith('6 Resolution: checkerboard test'), g.nx, g.nz],
      [pageWith('6 Resolution: checkerboard test'), g.nx, g.nz],
    ]);
  });

  it('gives the same bytes for the same input', async () => {
    expect((await renderInversionReportPdf(input)).equals(pdf)).toBe(true);
  }, 120_000);
});
