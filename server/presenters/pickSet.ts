import { sToMs } from '../../shared/units';
import { runPickQc, type QcPick } from '../../shared/qc';
import type { PickSetHead, RevisionRow, StoredPick } from '../services/pickSets';

const presentRevision = (r: RevisionRow) => ({
  number: r.number, createdAt: r.createdAt, createdBy: r.createdBy, comment: r.comment, excluded: r.exclusions.length,
});

/** A pick set at one revision: picks in ms at the edge, exclusions applied, and the quality checks. */
export function presentPickSet(head: PickSetHead, picks: StoredPick[], revisions: RevisionRow[], revision: RevisionRow) {
  const reasons = new Map(revision.exclusions.map((e) => [e.index, e.reason]));
  const qcInput: QcPick[] = picks.map((p) => ({
    index: p.index, shotId: p.shotId, sourceX: p.sourceX, receiverX: p.receiverX, time: p.time, sigma: p.sigma, excluded: reasons.has(p.index),
  }));
  const shots = new Map<string, { shotId: string; sourceX: number; sourceZ: number | null; picks: number }>();
  for (const p of picks) {
    const s = shots.get(p.shotId) ?? { shotId: p.shotId, sourceX: p.sourceX, sourceZ: p.sourceZ, picks: 0 };
    s.picks++;
    shots.set(p.shotId, s);
  }
  const RECIPROCAL_TOLERANCE_MS = 2; // common practice, no source
  return {
    id: head.id,
    lineId: head.lineId,
    fileName: head.fileName,
    sizeBytes: head.sizeBytes,
    createdAt: head.createdAt,
    createdBy: head.createdBy,
    revision: { number: revision.number, createdAt: revision.createdAt, createdBy: revision.createdBy, comment: revision.comment },
    revisions: revisions.map(presentRevision),
    shots: [...shots.values()],
    picks: picks.map((p) => ({
      index: p.index, line: p.line, shotId: p.shotId, sourceX: p.sourceX, sourceZ: p.sourceZ, receiverX: p.receiverX, receiverZ: p.receiverZ,
      timeMs: sToMs(p.time), sigmaMs: sToMs(p.sigma), excluded: reasons.has(p.index), exclusionReason: reasons.get(p.index) ?? null,
    })),
    qc: { reciprocalToleranceMs: RECIPROCAL_TOLERANCE_MS, ...runPickQc(qcInput, { reciprocalToleranceS: RECIPROCAL_TOLERANCE_MS / 1000 }) },
  };
}

export type PresentedPickSet = ReturnType<typeof presentPickSet>;
