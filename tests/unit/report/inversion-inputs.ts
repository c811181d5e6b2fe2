/**
 * A hand-made inversion report input whose answers are known without running anything: flat ground
 * at z = 20 m over a 41 × 21 grid of 1 m nodes, velocity v = 500 + 100·depth (m/s), so 1500 m/s lies
 * exactly 10 m below ground wherever the gradient holds. Around it, one case of each "not resolved":
 *   x = 15: nodes at 8–12 m depth crossed by no ray (coverage 0) → too little ray coverage;
 *   x = 25: DOI only 5 m below ground → the 10 m crossing lies below the DOI;
 *   x = 35: no ray in columns 34–36 (DOI null) → no ray reaches here;
 *   x = 40: columns 38–40 at 800 m/s throughout → not reached above the DOI.
 * Every other station: depth 10.0 m, elevation 10.0 m. Invented; not a real survey.
 */
import { DEFAULT_INVERSION_SETTINGS } from '../../../shared/schemas/inversions';
import type { InversionReportInput } from '../../../worker/report/inversion/types';

export const KNOWN_GRID = { x0: 0, dx: 1, nx: 41, z0: 20, dz: 1, nz: 21 };
export const UNCOVERED_BLOCK = { ix: [14, 16], iz: [8, 12] } as const;

export function knownInversionInput(over: Partial<InversionReportInput['inversion']> = {}): InversionReportInput {
  const g = KNOWN_GRID;
  const velocity: number[] = [];
  const coverage: number[] = [];
  for (let iz = 0; iz < g.nz; iz++) {
    for (let ix = 0; ix < g.nx; ix++) {
      velocity.push(ix >= 38 ? 800 : 500 + 100 * iz * g.dz);
      const hidden = ix >= UNCOVERED_BLOCK.ix[0] && ix <= UNCOVERED_BLOCK.ix[1] && iz >= UNCOVERED_BLOCK.iz[0] && iz <= UNCOVERED_BLOCK.iz[1];
      coverage.push(hidden ? 0 : 5);
    }
  }
  // DOI as depth below ground (m), stored as elevation.
  const doi = Array.from({ length: g.nx }, (_, ix): number | null => (ix >= 34 && ix <= 36 ? null : ix >= 24 && ix <= 26 ? 5 : 15));
  const stations = Array.from({ length: 9 }, (_, i) => ({ station: `G${i + 1}`, x: 5 * i, z: 20 }));
  const shots = [
    { shotId: 'W', sourceX: 0, sourceZ: 20 },
    { shotId: 'E', sourceX: 40, sourceZ: 20 },
  ];
  const residuals = shots.flatMap((s) =>
    stations.filter((st) => st.x !== s.sourceX).map((st, i) => {
      const computedMs = Math.abs(st.x - s.sourceX) / 0.9;
      const residualMs = ((i % 3) - 1) * 0.4;
      return { shotId: s.shotId, receiverX: st.x, observedMs: computedMs + residualMs, computedMs, residualMs, sigmaMs: 0.5, excluded: false };
    }),
  );
  return {
    reportId: 'rep-known',
    status: 'draft',
    date: new Date(Date.UTC(2026, 0, 5)),
    consultancy: 'Ashgrove Ground Imaging (fictional)',
    project: { name: 'Known-answer bench', site: 'Test bench (fictional site)', clientOrganisation: 'Nobody in particular (fictional)' },
    line: { name: 'KA-1', notes: '' },
    preparedBy: 'Imogen Tarrant',
    reviewedBy: null,
    stations,
    shots,
    inversion: {
      id: 'inv-known',
      label: '',
      createdAt: new Date(Date.UTC(2026, 0, 4)),
      pickSetFile: 'ka-1.picks.csv',
      pickSetRevision: 1,
      grid: { ...g },
      surface: null,
      velocity,
      coverage,
      doi: doi.map((d) => (d === null ? null : 20 - d)),
      history: [
        { iteration: 0, chi2: 9.5, rmsMs: 2.1, smoothing: null },
        { iteration: 1, chi2: 1.02, rmsMs: 0.51, smoothing: 50 },
      ],
      stopReason: 'target-misfit',
      settings: { ...DEFAULT_INVERSION_SETTINGS },
      start: { kind: 'gradient', spacing: 1, v0: 500, k: 100 },
      checkerboard: null,
      ...over,
    },
    residuals,
    isoVelocity: 1500,
  };
}
