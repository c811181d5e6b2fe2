/**
 * From the API's views of an inversion (InversionView, InversionSectionView: whole-number
 * velocities, null in the air) to the report: what the worker will do. The views are written here
 * from the stored fixture the way the API presents an inversion, not by the code under test.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { smallInversionReportInput, storedInversionFixture } from '../../../fixtures/report/inversion';
import type { InversionSectionView, InversionView } from '../../../shared/schemas/inversions';
import { inversionReportInput, type InversionReportSources } from '../../../worker/report/inversion/from-views';
import { renderInversionReportPdf } from '../../../worker/report/inversion/render';
import { normalisedLines, pageTexts } from './poppler';

function sources(): InversionReportSources {
  const f = storedInversionFixture();
  const base = smallInversionReportInput();
  const last = f.history[f.history.length - 1];
  const view: InversionView = {
    id: 'inv-view-7',
    lineId: '00000000-0000-4000-8000-000000000001',
    label: 'from the views',
    status: 'done',
    pickSetId: '00000000-0000-4000-8000-000000000002',
    pickSetRevision: 5,
    start: { kind: 'gradient', spacing: 1, v0: f.start.v0, k: f.start.k },
    grid: f.grid,
    settings: f.settings,
    history: f.history,
    progress: { iteration: last.iteration, maxIterations: f.settings.maxIterations },
    stats: { chi2: last.chi2, rms_ms: last.rmsMs, picks: f.residuals.length, shots: f.shots.length, iterations: last.iteration, stopReason: f.stopReason, checkerboardCorrelation: f.checkerboard.correlation, timings: { forward: 1, matrix: 0.1, lsqr: 0.2, total: 1.4 } },
    savedModelId: null,
    createdAt: '2026-03-20T08:00:00.000Z',
    startedAt: '2026-03-20T08:00:01.000Z',
    finishedAt: '2026-03-20T08:00:03.000Z',
  };
  const section: InversionSectionView = {
    grid: f.grid,
    surface: f.surface,
    velocity: f.velocity.map((v) => (v === null ? null : Math.round(v))),
    coverage: f.coverage,
    hits: f.coverage.map((c) => (c === null ? null : Math.ceil(c))),
    doi: f.doi,
    checkerboard: { size: f.checkerboard.size, amplitude: f.checkerboard.amplitude, correlation: f.checkerboard.correlation!, coverageThreshold: 1, truePattern: Array.from(f.checkerboard.truePattern), recovered: Array.from(f.checkerboard.recovered) },
    shots: f.shots.map((s) => ({ shotId: s.shotId, x: s.sourceX, z: s.sourceZ })),
    stations: f.stations.map((s) => ({ station: `ST${s.station}`, x: s.x, z: s.z })),
  };
  const { reportId, status, date, consultancy, project, line, preparedBy, reviewedBy } = base;
  return { meta: { reportId, status, date, consultancy, project, line, preparedBy, reviewedBy }, view, section, pickSetFile: 'sp-1.picks.csv', residuals: base.residuals, isoVelocity: 2500 };
}

describe('inversion report from the API views', () => {
  it('renders what the views hold: station names, revision, label, date, every iteration', async () => {
    const path = join(mkdtempSync(join(tmpdir(), 'timefield-inv-views-')), 'views.pdf');
    writeFileSync(path, await renderInversionReportPdf(inversionReportInput(sources())));
    const flow = normalisedLines(pageTexts(path).join('\n')).join(' ');
    expect(flow).toContain('inversion inv-view-7 (2026-03-20) of pick set sp-1.picks.csv revision 5');
    expect(flow).toContain('"from the views"');
    expect(flow).toMatch(/ST105 10\.00 \S+ (\d+\.\d|not )/); // station names from the section view in the depth table
    expect(flow).toContain('(at least 1 m of ray)');
    for (const h of sources().view.history) expect(flow).toContain(`${h.iteration} ${h.chi2.toFixed(2)} ${h.rmsMs.toFixed(2)} `);
    expect(flow).not.toMatch(/NaN|undefined|Infinity/);
  }, 60_000);

  it('refuses an inversion without a result, and a gradient start whose fit is missing, with the path', async () => {
    const s = sources();
    expect(() => inversionReportInput({ ...s, view: { ...s.view, status: 'running', stats: null } })).toThrow(/^view\.stats: the inversion has no result yet \(status running\)$/);
    const noFit = inversionReportInput({ ...s, view: { ...s.view, start: { kind: 'gradient', spacing: 1, v0: null, k: null } } });
    await expect(renderInversionReportPdf(noFit)).rejects.toThrow(/^inversion\.start\.v0: must be a finite number/);
  });
});
