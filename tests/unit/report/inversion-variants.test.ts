/**
 * The inversion report on a hand-made input whose answers are known (inversion-inputs.ts: a linear
 * gradient v = 500 + 100·depth, so 1500 m/s lies exactly 10 m below ground), and on variants of it:
 * the iso-velocity depth table with each reason for "not resolved", the coverage mask in the
 * section's raster (read back with pdfimages), the DOI line on the rendered page (pdftoppm), the
 * report without a checkerboard test, and inputs refused with the path of the bad value.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { smallInversionReportInput } from '../../../fixtures/report/inversion';
import { logTicks } from '../../../worker/report/inversion/convergence-figure';
import { renderInversionReportPdf } from '../../../worker/report/inversion/render';
import type { InversionReportInput } from '../../../worker/report/inversion/types';
import { KNOWN_GRID, knownInversionInput, UNCOVERED_BLOCK } from './inversion-inputs';
import { extractImages, normalisedLines, pageTexts, readPpm, renderPage } from './poppler';

const dir = mkdtempSync(join(tmpdir(), 'timefield-inversion-variants-'));
let serial = 0;

async function render(input: InversionReportInput): Promise<{ path: string; pages: string[]; lines: string[]; flow: string }> {
  const path = join(dir, `r${++serial}.pdf`);
  writeFileSync(path, await renderInversionReportPdf(input));
  const pages = pageTexts(path);
  const lines = normalisedLines(pages.join('\n'));
  return { path, pages, lines, flow: lines.join(' ') };
}

const neutral = (r: number, g: number, b: number) => Math.max(r, g, b) - Math.min(r, g, b) <= 6 && r > 150 && r < 240;

describe('inversion report on a known answer', () => {
  it('tabulates the depth to 1500 m/s: 10.0 m where resolved, and says why elsewhere', async () => {
    const { lines, flow } = await render(knownInversionInput());
    // v = 500 + 100·depth reaches 1500 m/s at depth 10 m exactly (linear gradient; iso-depth interpolates linearly).
    for (const [station, x] of [['G1', 0], ['G2', 5], ['G3', 10], ['G5', 20], ['G7', 30]] as const) {
      expect(lines, String(station)).toContain(`${station} ${x.toFixed(2)} 20.00 10.0 10.0`);
    }
    expect(lines).toContain('G4 15.00 20.00 not resolved: too little ray coverage —'); // nodes 8–12 m deep at x 14–16 m carry no ray
    expect(lines).toContain('G6 25.00 20.00 not resolved: below the DOI —'); // DOI 5 m deep there
    expect(lines).toContain('G8 35.00 20.00 not resolved: no ray reaches here —'); // DOI null at x 34–36 m
    expect(lines).toContain('G9 40.00 20.00 not reached above the DOI —'); // 800 m/s throughout
    expect(flow).toContain('At 5 of 9 stations the 1500 m/s surface lies 10.0 m to 10.0 m below ground');
  }, 60_000);

  it('greys exactly the nodes below the coverage threshold in the section raster', async () => {
    const { path, pages } = await render(knownInversionInput());
    const page = pages.findIndex((p) => p.includes('Velocity section from the inversion')) + 1;
    const [first] = extractImages(path, page, join(dir, 'known-section'));
    const img = readPpm(first);
    expect([img.width, img.height]).toEqual([KNOWN_GRID.nx, KNOWN_GRID.nz]);
    let grey = 0;
    for (let iz = 0; iz < img.height; iz++) {
      for (let ix = 0; ix < img.width; ix++) {
        const p = 3 * (iz * img.width + ix);
        const inBlock = ix >= UNCOVERED_BLOCK.ix[0] && ix <= UNCOVERED_BLOCK.ix[1] && iz >= UNCOVERED_BLOCK.iz[0] && iz <= UNCOVERED_BLOCK.iz[1];
        const isGrey = neutral(img.rgb[p], img.rgb[p + 1], img.rgb[p + 2]);
        expect(isGrey, `node ${ix}, ${iz}`).toBe(inBlock);
        if (isGrey) grey++;
      }
    }
    expect(grey).toBe(15); // 3 columns × 5 rows
  }, 60_000);

  it('colours the section on the project scale when the report carries one (issue 17 item 6), and says so', async () => {
    // Stops of the product's velocity scale (shared/colour/velocity-scale.ts), interpolated here on their own
    // so the check does not run through the report's colour code.
    const stops: [number, number[]][] = [[0, [246, 231, 200]], [0.3, [223, 232, 201]], [0.6, [181, 214, 214]], [1, [127, 169, 201]]];
    const expected = (v: number) => {
      const t = Math.min(1, Math.max(0, (v - 300) / (3300 - 300)));
      const k = stops.findIndex(([at]) => at >= t);
      if (k <= 0) return stops[0][1];
      const [t0, c0] = stops[k - 1], [t1, c1] = stops[k];
      return c0.map((c, i) => c + ((c1[i] - c) * (t - t0)) / (t1 - t0));
    };
    const input = { ...knownInversionInput(), velocityColours: { min: 300, max: 3300 } };
    const { path, pages, flow } = await render(input);
    expect(flow).toContain('Colours give the velocity on one scale from 300 to 3300 m/s, the project\'s scale');
    expect(flow).toContain('velocities in the covered nodes: 500 to 2500 m/s');
    expect(flow, 'no number printed with a floating-point tail (a one-step convergence axis once read 0.6000000000000001)').not.toMatch(/\d\.\d{7,}/);
    const page = pages.findIndex((p) => p.includes('Velocity section from the inversion')) + 1;
    const img = readPpm(extractImages(path, page, join(dir, 'project-scale'))[0]);
    const velocity = input.inversion.velocity as number[];
    let checked = 0;
    for (let i = 0; i < velocity.length; i++) {
      const px = [img.rgb[3 * i], img.rgb[3 * i + 1], img.rgb[3 * i + 2]];
      if (neutral(px[0], px[1], px[2])) continue; // greyed: no coverage
      expected(velocity[i]).forEach((c, k) => expect(Math.abs(px[k] - c), `node ${i}`).toBeLessThanOrEqual(1));
      checked++;
    }
    expect(checked).toBeGreaterThan(velocity.length / 2);
  }, 60_000);

  it('adds the depth-to-rock table in map coordinates when the stations carry them (issue 19 item 3)', async () => {
    const base = knownInversionInput();
    const input = { ...base, crs: 'EPSG:32633 WGS 84 / UTM zone 33N', stations: base.stations.map((st) => ({ ...st, easting: 500000 + st.x, northing: 5000000 })) };
    const { lines, flow } = await render(input);
    expect(flow).toContain('in map coordinates (EPSG:32633 WGS 84 / UTM zone 33N)');
    expect(lines).toContain('G1 500000.00 5000000.00 20.00 10.0 10.0'); // as the chainage table: 10 m at G1
    expect(lines).toContain('G4 500015.00 5000000.00 20.00 — —'); // not resolved there
    const plain = await render(knownInversionInput());
    expect(plain.flow).not.toContain('in map coordinates');
  }, 60_000);

  it('moves the mask with the threshold given: 6 m of ray greys every node (5 m each), 0 none', async () => {
    for (const [threshold, share] of [[6, 1], [0, 0]] as const) {
      const input = { ...knownInversionInput(), coverageThreshold: threshold };
      const { path, pages, flow } = await render(input);
      const page = pages.findIndex((p) => p.includes('Velocity section from the inversion')) + 1;
      const img = readPpm(extractImages(path, page, join(dir, `threshold-${threshold}`))[0]);
      let grey = 0;
      for (let i = 0; i < img.rgb.length; i += 3) if (neutral(img.rgb[i], img.rgb[i + 1], img.rgb[i + 2])) grey++;
      expect(grey / (img.width * img.height)).toBe(share);
      expect(flow).toContain(`nodes crossed by less than ${threshold} m of ray in total`);
    }
  }, 60_000);

  it('draws the DOI line (purple, dashed) when rays reach, and says there is none when none do', async () => {
    const purple = (r: number, g: number, b: number) => Math.abs(r - 107) < 30 && Math.abs(g - 45) < 30 && Math.abs(b - 92) < 30;
    const count = async (input: InversionReportInput, name: string) => {
      const { path, pages, flow } = await render(input);
      const page = pages.findIndex((p) => p.includes('Velocity section from the inversion')) + 1;
      const img = readPpm(renderPage(path, page, join(dir, name), 'ppm', 100));
      let n = 0;
      for (let i = 0; i < img.rgb.length; i += 3) if (purple(img.rgb[i], img.rgb[i + 1], img.rgb[i + 2])) n++;
      return { n, flow, words: normalisedLines(pages[page - 1]) };
    };
    const withDoi = await count(knownInversionInput(), 'doi');
    expect(withDoi.n).toBeGreaterThan(100);
    expect(withDoi.words.some((l) => /\bDOI\b/.test(l) && !l.startsWith('Figure'))).toBe(true); // the label in the figure
    const none = await count(knownInversionInput({ doi: new Array(KNOWN_GRID.nx).fill(null) }), 'no-doi');
    expect(none.n).toBe(0);
    expect(none.flow).toContain('No ray reaches below the surface: there is no depth of investigation.');
  }, 60_000);

  it('numbers the sections without a checkerboard test, and cautions become section 7', async () => {
    const { lines, flow } = await render(knownInversionInput());
    for (const h of ['1 Velocity section from the inversion', '2 Depth to the 1500 m/s surface', '3 Boreholes and ties', '4 Convergence', '5 Misfit of the final model', '6 Method statement and settings', '7 Limitations and cautions']) expect(lines, h).toContain(h);
    expect(flow).not.toContain('checkerboard test with');
    expect(flow).toContain('Checkerboard test not run');
    expect(flow).toContain('section 7, Limitations and cautions');
  }, 60_000);

  it('names a saved starting model and a fixed smoothing weight', async () => {
    const base = knownInversionInput({
      start: { kind: 'model', modelName: 'KA-1 layered', modelVersion: 4 },
      settings: { ...knownInversionInput().inversion.settings, smoothing: 12.5 },
    });
    const { flow, pages } = await render(base);
    expect(flow).toContain('Starting model saved model "KA-1 layered", version 4');
    expect(flow).toContain('Smoothing weight fixed by the user at 12.5');
    expect(normalisedLines(pages[0]).join(' ')).toContain('starting model: model version 4.');
  }, 60_000);

  it('says when the checkerboard correlation could not be computed, never NaN', async () => {
    const base = smallInversionReportInput();
    const input = { ...base, inversion: { ...base.inversion, checkerboard: { ...base.inversion.checkerboard!, correlation: null } } };
    const { flow } = await render(input);
    expect(flow).toContain('could not be computed: the recovered pattern is flat');
    expect(flow).not.toMatch(/NaN|undefined|Infinity/);
  }, 60_000);
});

describe('inversion report: bad input', () => {
  const base = knownInversionInput;
  const withInversion = (over: Partial<InversionReportInput['inversion']>) => knownInversionInput(over);

  it('refuses each bad value with its path', async () => {
    await expect(renderInversionReportPdf(withInversion({ velocity: [1, 2, 3] }))).rejects.toThrow(/^inversion\.velocity: must hold 861 values \(got 3\)$/);
    const velocity = base().inversion.velocity as number[];
    await expect(renderInversionReportPdf(withInversion({ velocity: velocity.map((v, i) => (i === 7 ? -5 : v)) }))).rejects.toThrow(/^inversion\.velocity\[7\]: must be a velocity > 0 m\/s, or null in the air \(got -5\)$/);
    await expect(renderInversionReportPdf(withInversion({ velocity: velocity.map(() => null) }))).rejects.toThrow(/^inversion\.velocity: has no ground node/);
    await expect(renderInversionReportPdf(withInversion({ coverage: (base().inversion.coverage as number[]).map((c, i) => (i === 12 ? -1 : c)) }))).rejects.toThrow(/^inversion\.coverage\[12\]: must be a ray length ≥ 0 m/);
    await expect(renderInversionReportPdf(withInversion({ doi: [10, 10] }))).rejects.toThrow(/^inversion\.doi: must hold 41 values \(got 2\)$/);
    const history = [...base().inversion.history];
    history[1] = { ...history[1], chi2: Number.NaN };
    await expect(renderInversionReportPdf(withInversion({ history }))).rejects.toThrow(/^inversion\.history\[1\]\.chi2: must be a finite number ≥ 0 \(got NaN\)$/);
    await expect(renderInversionReportPdf(withInversion({ history: [] }))).rejects.toThrow(/^inversion\.history: must hold at least the starting model/);
    await expect(renderInversionReportPdf(withInversion({ settings: { ...base().inversion.settings, vMin: 3000, vMax: 2000 } }))).rejects.toThrow(/^inversion\.settings\.vMax: must be greater than vMin/);
    await expect(renderInversionReportPdf(withInversion({ surface: [[0, 20], [0, 21]] }))).rejects.toThrow(/^inversion\.surface\[1\]: x must increase/);
    await expect(renderInversionReportPdf(withInversion({ grid: { ...KNOWN_GRID, dz: 0 } }))).rejects.toThrow(/^inversion\.grid\.dz: must be a spacing > 0 m/);
    await expect(renderInversionReportPdf(withInversion({ start: { kind: 'gradient', spacing: 1, v0: Number.NaN, k: 100 } }))).rejects.toThrow(/^inversion\.start\.v0: must be a finite number/);
    await expect(renderInversionReportPdf({ ...base(), isoVelocity: 0 })).rejects.toThrow(/^isoVelocity: must be a velocity > 0 m\/s/);
    await expect(renderInversionReportPdf({ ...base(), coverageThreshold: -1 })).rejects.toThrow(/^coverageThreshold: must be a ray length ≥ 0 m/);
    const residuals = base().residuals.map((r, i) => (i === 2 ? { ...r, sigmaMs: 0 } : r));
    await expect(renderInversionReportPdf({ ...base(), residuals })).rejects.toThrow(/^residuals\[2\]\.sigmaMs: must be > 0$/);
  }, 60_000);

  it('refuses a checkerboard pattern of the wrong size', async () => {
    const f = smallInversionReportInput();
    const input = { ...f, inversion: { ...f.inversion, checkerboard: { ...f.inversion.checkerboard!, recovered: [0.1] } } };
    await expect(renderInversionReportPdf(input)).rejects.toThrow(/^inversion\.checkerboard\.recovered: must hold 1971 values \(got 1\)$/);
  });
});

describe('convergence chart ticks', () => {
  it('labels a logarithmic χ² axis at 1, 2 and 5 of every decade it spans (common practice, no source)', () => {
    expect(logTicks(0.8, 13)).toEqual([1, 2, 5, 10]);
    expect(logTicks(0.3, 1.2)).toEqual([0.5, 1]);
    expect(logTicks(0.9, 260)).toEqual([1, 2, 5, 10, 20, 50, 100, 200]);
  });
});

describe('inversion report with an ensemble', () => {
  it('states the accuracy from the band (median width over the banded stations, hand-computed) and tabulates it per station', async () => {
    const input = knownInversionInput();
    // Widths 2.0, 1.0 and 3.0 m at three stations, none at the fourth: median 2.0 m, range 1.0–3.0 m.
    const bands = [
      { station: 'G1', x: 0, groundZ: 20, resolved: 10, p5: 9, median: 10, p95: 11 },
      { station: 'G2', x: 5, groundZ: 20, resolved: 10, p5: 9.5, median: 10, p95: 10.5 },
      { station: 'G3', x: 10, groundZ: 20, resolved: 9, p5: 8, median: 10, p95: 11 },
      { station: 'G4', x: 15, groundZ: 20, resolved: 3, p5: null, median: null, p95: null },
    ];
    const holes = [
      { name: 'BH1', kind: 'borehole' as const, x: 2.5, groundZ: 20, waterDepth: null, contacts: [{ depth: 0, material: 'soil', rockTop: false }, { depth: 9.8, material: 'rock', rockTop: true }] },
      { name: 'BH2', kind: 'borehole' as const, x: 7.5, groundZ: 20, waterDepth: null, contacts: [{ depth: 12, material: 'rock', rockTop: true }] },
    ];
    const { flow, lines } = await render({ ...input, boreholes: holes, ensemble: { members: 12, used: 10, excluded: 2, maxChi2: 1.2, seed: 7, vary: { start: true, smoothing: true, picks: 'sigma' }, rock: { min: 1500, max: 1500 }, bands } });
    expect(flow).toContain('Accuracy of the depth to 1500 m/s');
    expect(flow).toContain('the 5–95 % band of 10 ensemble members is 2.0 m wide at the median station (1.0–3.0 m), about ±1.0 m, at the 3 of 4 stations where the rays resolve it');
    expect(flow).toContain('10 members explain the picks to χ² ≤ 1.20 and make the band; 2 explained them worse and were left out');
    expect(flow).toContain('The band covers only what was varied between the members');
    // BH1 half-way between G1 (9–11) and G2 (9.5–10.5): 9.25–10.75 m; BH2 between G2 and G3 (8–11): 8.75–10.75 m.
    expect(flow).toContain('BH1 (x 2.5 m) logs the top of rock at 9.8 m, band 9.3–10.8 m: inside the band; BH2 (x 7.5 m) logs the top of rock at 12.0 m, band 8.8–10.8 m: deeper than the band');
    expect(lines).toContain('G2 5.00 9.5 10.0 10.5 1.0 10');
    expect(lines).toContain('G4 15.00 — — — — 3');
    // Without an ensemble the section is not there.
    expect((await render(input)).flow).not.toContain('Accuracy of the depth to');
  }, 60_000);
});
