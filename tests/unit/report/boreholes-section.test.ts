/**
 * "Boreholes and ties" in the forward-run PDF, read back with pdftotext: the logs as given, and each
 * contact against the top of the model's deepest layer, worked out here by hand from the fixture's
 * polylines (linear between vertices), and against the 2000 m/s surface (shared/model/iso-depth on
 * the rasterised model, as the depth table of the report is checked in render-pdf.test.ts).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { SMALL_MODEL, smallReportInput } from '../../../fixtures/report/small';
import { parseModelFile, rasteriseModel } from '../../../shared/model';
import { isoVelocityDepth } from '../../../shared/model/iso-depth';
import { smallInversionReportInput } from '../../../fixtures/report/inversion';
import { renderInversionReportPdf } from '../../../worker/report/inversion/render';
import { inversionIsoDepth } from '../../../worker/report/inversion/iso-depth';
import { InversionContext } from '../../../worker/report/inversion/context';
import { renderReportPdf } from '../../../worker/report/render';
import { normalisedLines, pageTexts } from './poppler';

let flow = '';
beforeAll(async () => {
  const input = smallReportInput({
    boreholes: [
      { name: 'BH-7', kind: 'borehole', x: 40, groundZ: null, waterDepth: 3.5, contacts: [{ depth: 0, material: 'clay', rockTop: false }, { depth: 15, material: 'mudstone', rockTop: true }] },
      { name: 'TP-2', kind: 'trial_pit', x: 70, groundZ: 50.6, waterDepth: null, contacts: [{ depth: 0, material: 'topsoil', rockTop: false }, { depth: 1.2, material: 'clay', rockTop: false }] },
    ],
  });
  const path = join(mkdtempSync(join(tmpdir(), 'timefield-holes-')), 'report.pdf');
  writeFileSync(path, await renderReportPdf(input));
  flow = normalisedLines(pageTexts(path).join('\n')).join(' ');
}, 120_000);

describe('report: boreholes and ties', () => {
  it('lists the logs as entered, ground from the stations where none is logged', () => {
    expect(flow).toContain('4 Boreholes and ties');
    expect(flow).toContain('1 borehole and 1 trial pit on the line');
    // BH-7 at x = 40 m sits on station 1009 (z 51.00 m); TP-2 keeps its logged 50.6 m.
    expect(flow).toMatch(/BH-7 borehole 40\.0 51\.00 3\.5 0\.0 clay; 15\.0 mudstone \(top of rock\)/);
    expect(flow).toMatch(/TP-2 trial pit 70\.0 50\.60 — 0\.0 topsoil; 1\.2 clay/);
  });

  it('ties each contact to the top of the deepest layer and to the 2000 m/s surface, interpreted − logged', () => {
    // Top of mudstone = base of the weathered mudstone, (−10, 41) to (80, 30). At x = 40: ground 51
    // (a vertex of the surface), base 41 − 11·50/90 = 34.889 → depth 16.111, +1.111 against 15.0.
    const parsed = parseModelFile(SMALL_MODEL);
    if (!parsed.ok) throw new Error('the fixture model does not parse');
    const iso = isoVelocityDepth(rasteriseModel(parsed.model), 2000, 40).depth!;
    expect(flow).toContain(`BH-7 mudstone 15.0 16.1 +1.1 ${iso.toFixed(1)} +${(iso - 15).toFixed(1)}`);
    // At x = 70: ground 51 − 0.6·30/40 = 50.55, base 41 − 11·80/90 = 31.222 → depth 19.328; the
    // pit marks no rock, so both contacts are tied; the 2000 m/s surface is not reached there.
    expect(flow).toContain('TP-2 topsoil 0.0 19.3 +19.3 not reached —');
    expect(flow).toContain('TP-2 clay 1.2 19.3 +18.1 not reached —');
    expect(flow).toContain('At the holes only.');
  });

  it('says so plainly when the line has no holes', async () => {
    const path = join(mkdtempSync(join(tmpdir(), 'timefield-noholes-')), 'report.pdf');
    writeFileSync(path, await renderReportPdf(smallReportInput()));
    const text = normalisedLines(pageTexts(path).join('\n')).join(' ');
    expect(text).toContain('No boreholes or trial pits had been entered for this line when this report was made');
  });

  it('in an inversion report: tied to the iso-velocity where the inversion resolves it, and says why not elsewhere', async () => {
    const base = smallInversionReportInput();
    const xs = base.stations.map((s) => s.x).sort((a, b) => a - b);
    const mid = xs[Math.floor(xs.length / 2)];
    const input = { ...base, boreholes: [{ name: 'BH-1', kind: 'borehole' as const, x: mid, groundZ: null, waterDepth: null, contacts: [{ depth: 4, material: 'rock', rockTop: true }] }] };
    const path = join(mkdtempSync(join(tmpdir(), 'timefield-invholes-')), 'report.pdf');
    writeFileSync(path, await renderInversionReportPdf(input));
    const text = normalisedLines(pageTexts(path).join('\n')).join(' ');
    expect(text).toContain('3 Boreholes and ties');
    // The same reading the report's own depth table uses, at the hole: a depth where resolved, else the reason.
    const ctx = new InversionContext(new (await import('pdfkit')).default(), input);
    const r = inversionIsoDepth(ctx, input.isoVelocity, mid);
    const expected = r.status === 'resolved' && r.result?.depth != null ? `BH-1 rock 4.0 ${r.result.depth.toFixed(1)}` : `BH-1 rock 4.0 ${r.status}`;
    expect(text).toContain(expected);
  });
});
