/**
 * Reports that differ from the main fixture: approved, a raw velocity grid without layers and a
 * first-order run with many shots, a run without picks, and inputs that must be refused with the
 * path of the bad value (never a NaN on a page).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { assembleReportInput } from '../../../fixtures/report/assemble';
import { smallReportInput } from '../../../fixtures/report/small';
import { renderReportPdf } from '../../../worker/report/render';
import type { ReportInput } from '../../../worker/report/types';
import { normalisedLines, pageTexts, pdfInfo } from './poppler';
import { interpretationRecord, interpretLayers } from '../../../shared/layers';
import { planarSurvey } from '../../references/layers/surveys';

const dir = mkdtempSync(join(tmpdir(), 'timefield-report-variants-'));

async function textOf(input: ReportInput, name: string): Promise<{ pages: string[]; flow: string }> {
  const path = join(dir, `${name}.pdf`);
  writeFileSync(path, await renderReportPdf(input));
  const pages = pageTexts(path);
  expect(pages).toHaveLength(Number(pdfInfo(path).Pages));
  return { pages, flow: normalisedLines(pages.join('\n')).join(' ') };
}

/** Velocity grid given node by node (no layers, no surface): 500 m/s at the top, +60 m/s per metre down. */
function rawGridInput(): ReportInput {
  const grid = { x0: 0, dx: 1, nx: 31, z0: 20, dz: 1, nz: 11 };
  const velocity = Array.from({ length: grid.nx * grid.nz }, (_, i) => 500 + 60 * Math.floor(i / grid.nx));
  const shots = Array.from({ length: 12 }, (_, k) => ({ shotId: `P${k + 1}`, sourceX: 2.5 * k, sourceZ: null }));
  const stations = Array.from({ length: 7 }, (_, i) => ({ station: 1 + i, x: 5 * i, z: 20 }));
  return assembleReportInput({
    meta: {
      reportId: 'rep-raw',
      status: 'submitted',
      date: new Date(Date.UTC(2025, 0, 9)),
      consultancy: 'Ashgrove Ground Imaging (fictional)',
      project: { name: 'Raw grid trial', site: 'Test bench (fictional site)', clientOrganisation: 'Nobody in particular (fictional)' },
      line: { name: 'RG-1', notes: '' },
      preparedBy: 'Imogen Tarrant',
      reviewedBy: null,
      acquisitionNotes: '',
    },
    modelJson: { format: 'timefield-model/1', grid, velocity },
    modelName: 'raw grid',
    modelVersion: 1,
    modelComment: '',
    stations,
    shots,
    picks: shots.flatMap((s) => stations.map((st) => ({ shotId: s.shotId, receiverX: st.x, observed: (t: number) => t + 0.0002, sigma: 0.001 }))),
    order: 1,
    pickSetFile: 'raw.picks.csv',
    pickSetRevision: 0,
    sectionShotId: 'P1',
    isoVelocity: 5000,
  });
}

describe('PDF summary variants', () => {
  it('an approved report names its reviewer on the cover and its status in every footer, however long the project name', async () => {
    const base = smallReportInput();
    const name = `Brackenhurst cutting widening, ${'phase two of the eastern embankment and drainage works, '.repeat(3)}final`;
    const { pages, flow } = await textOf({ ...base, project: { ...base.project, name }, status: 'approved', reviewedBy: 'Helen Marsh' }, 'approved');
    expect(flow).toContain('Reviewed by Helen Marsh');
    expect(flow).toContain('Approved for issue by Helen Marsh');
    expect(flow).not.toContain('not yet reviewed');
    pages.forEach((p, i) => {
      const footer = normalisedLines(p).at(-1)!;
      expect(footer).toMatch(new RegExp(`^Brackenhurst cutting widening, .*… · line BH-2 · report approved page ${i + 1} of ${pages.length}$`));
    });
  }, 120_000);

  it('a raw velocity grid, first-order run with many shots: no interfaces, an iso-velocity never reached, every shot listed', async () => {
    const input = rawGridInput();
    const { flow } = await textOf(input, 'raw');
    expect(flow).toContain('The model is a velocity grid without layer interfaces');
    expect(flow).toContain('Scheme order first order');
    expect(flow).toContain('dx = 1 m, dz = 1 m; 31 × 11 nodes');
    expect(flow).toContain('The velocity 5000 m/s is not reached within the model at any station.');
    for (let s = 1; s <= 7; s++) expect(flow).toContain(`${s} ${(5 * (s - 1)).toFixed(2)} 20.00 not reached within the model —`);
    for (const s of input.shots) expect(flow).toContain(`shot ${s.shotId}`); // legend of the travel-time curves
    expect(flow).toContain('Pick uncertainty σ 1 ms for every pick');
  }, 120_000);

  it('a run without picks prints dashes, not NaN', async () => {
    const base = smallReportInput();
    const stats = { ...base.run.stats, rms_ms: null, chi2: null, max_abs_residual_ms: null, mean_residual_ms: null, picks: 0, excluded: 0, by_shot: [], by_receiver: [] };
    const { flow } = await textOf({ ...base, residuals: [], run: { ...base.run, stats } }, 'empty');
    expect(flow).toContain('RMS misfit — ms');
    expect(flow).toContain('No residuals to show.');
    expect(flow).not.toMatch(/NaN|Infinity|undefined/);
  }, 120_000);

  it('refuses bad input with the path of the bad value', async () => {
    const base = smallReportInput();
    await expect(renderReportPdf({ ...base, isoVelocity: 0 })).rejects.toThrow(/^isoVelocity: must be a velocity > 0 m\/s/);
    const residuals = base.residuals.map((r, i) => (i === 3 ? { ...r, observedMs: Number.NaN } : r));
    await expect(renderReportPdf({ ...base, residuals })).rejects.toThrow(/^residuals\[3\]\.observedMs: must be a finite number/);
    await expect(renderReportPdf({ ...base, section: { ...base.section, times: new Float32Array(5) } })).rejects.toThrow(/^section\.times: must hold nx·nz = 3731 values \(got 5\)/);
    await expect(renderReportPdf({ ...base, stations: [{ station: 1, x: Number.POSITIVE_INFINITY, z: 50 }] })).rejects.toThrow(/^stations\[0\]\.x/);
  }, 120_000);
});

describe('PDF summary of a model saved from the layer methods', () => {
  it('adds the layer interpretation (method named, layer table, depths, limits) and renumbers the sections after it', async () => {
    // Exact two-layer times (Telford, Geldart & Sheriff 1990, §4.3): V1 500, V2 2000 m/s, refractor 10 m deep.
    const survey = planarSurvey(500, 2000, 10, 0, 0);
    const result = interpretLayers(survey.shots, survey.surfaceZ, { method: 'grm', layers: 2 });
    const base = smallReportInput();
    const file = { ...base.model.file, interpretation: interpretationRecord(result, 'exact.picks.csv revision 0', 3) };
    const { flow } = await textOf({ ...base, model: { ...base.model, file } }, 'layers');
    expect(flow).toContain('5 Layer interpretation behind the model');
    expect(flow).toContain('Depth section of the interpretation: ground surface of the model (grey), refractor 1 at the interpreted elevation under each geophone');
    expect(flow).toContain('generalized reciprocal method (Palmer 1980, 1981)');
    expect(flow).toContain(`XY = ${plainNumber(result.xy!)} m`);
    expect(flow).toContain('3 picks were assigned to a refractor by hand');
    expect(flow).toMatch(/1 \(top\) 500 10\.0 – 10\.0/);
    expect(flow).toMatch(/2 \(below refractor 1\) 2000 —/);
    for (const d of result.depths.slice(0, 5)) expect(flow).toContain(`${d.x.toFixed(2)} 1 10.00`);
    expect(flow).toContain('9 Limitations and cautions');
    expect(flow).toContain('section 9, Limitations and cautions');
    expect(flow).not.toMatch(/NaN|Infinity|undefined/);

    const plain = await textOf(base, 'no-layers');
    expect(plain.flow).not.toContain('Layer interpretation');
    expect(plain.flow).toContain('8 Limitations and cautions');
  }, 120_000);
});

const plainNumber = (v: number) => String(+v.toFixed(2));
