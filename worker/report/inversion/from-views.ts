/**
 * The report's input from what the API already serves for an inversion (InversionView and
 * InversionSectionView, shared/schemas/inversions.ts) plus what only the report needs: its meta,
 * the pick-set file name, the starting model's name, one residual row per pick and the iso-velocity.
 * Pure; the worker calls it and then renderInversionReportPdf.
 */
import type { InversionSectionView, InversionView } from '../../../shared/schemas/inversions';
import type { ReportMeta, ReportResidual } from '../types';
import { ReportInputError } from '../validate';
import type { InversionReportInput } from './types';

export interface InversionReportSources {
  meta: ReportMeta;
  view: InversionView;
  section: InversionSectionView;
  pickSetFile: string;
  /** Name of the starting model version (model start only). */
  startModelName?: string;
  residuals: ReportResidual[];
  isoVelocity: number;
  coverageThreshold?: number;
}

export function inversionReportInput(o: InversionReportSources): InversionReportInput {
  const { view, section } = o;
  if (!view.stats) throw new ReportInputError('view.stats', `the inversion has no result yet (status ${view.status})`);
  const st = view.start;
  const start: InversionReportInput['inversion']['start'] =
    st.kind === 'gradient'
      ? { kind: 'gradient', spacing: st.spacing, v0: st.v0 ?? Number.NaN, k: st.k ?? Number.NaN }
      : { kind: 'model', modelName: o.startModelName ?? '', modelVersion: st.modelVersion ?? Number.NaN };
  return {
    ...o.meta,
    stations: section.stations.map((s) => ({ station: s.station, x: s.x, z: s.z })),
    shots: section.shots.map((s) => ({ shotId: s.shotId, sourceX: s.x, sourceZ: s.z })),
    inversion: {
      id: view.id,
      label: view.label,
      createdAt: new Date(view.createdAt),
      pickSetFile: o.pickSetFile,
      pickSetRevision: view.pickSetRevision,
      grid: { ...section.grid },
      surface: section.surface,
      velocity: section.velocity,
      coverage: section.coverage,
      doi: section.doi,
      history: view.history.map((h) => ({ iteration: h.iteration, chi2: h.chi2, rmsMs: h.rmsMs, smoothing: h.smoothing })),
      stopReason: view.stats.stopReason,
      settings: { ...view.settings },
      start,
      checkerboard: section.checkerboard
        ? {
            size: section.checkerboard.size,
            amplitude: section.checkerboard.amplitude,
            correlation: section.checkerboard.correlation,
            coverageThreshold: section.checkerboard.coverageThreshold,
            truePattern: section.checkerboard.truePattern,
            recovered: section.checkerboard.recovered,
          }
        : null,
    },
    residuals: o.residuals,
    isoVelocity: o.isoVelocity,
    ...(o.coverageThreshold !== undefined ? { coverageThreshold: o.coverageThreshold } : {}),
  };
}
