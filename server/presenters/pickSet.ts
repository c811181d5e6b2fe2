import type { FarPositionResult } from '../../shared/qc';
import type { PickSetHead, RevisionRow } from '../services/pickSets';

const presentRevision = (r: RevisionRow) => ({
  number: r.number, createdAt: r.createdAt, createdBy: r.createdBy, comment: r.comment, excluded: r.exclusions.length,
});

export interface PickSetParts {
  head: PickSetHead;
  revisions: RevisionRow[];
  revision: RevisionRow;
  shots: { shotId: string; sourceX: number; sourceZ: number | null; picks: number }[];
  /** JSON array text of the picks (ms at the edge, exclusions applied), built by the database. */
  picksJson: string;
  /** JSON object text `{ reciprocalPairs, flags }`, stored per revision. */
  qcJson: string;
  reciprocalToleranceMs: number;
  far: FarPositionResult;
}

/**
 * A pick set at one revision: picks in ms, exclusions applied, and the quality checks, as JSON text.
 * The two large parts arrive as text and are spliced in unparsed, so a 200 000-pick set is never
 * turned into objects and back on the request thread.
 */
export function presentPickSetJson(p: PickSetParts): string {
  const rest = JSON.stringify({
    id: p.head.id,
    lineId: p.head.lineId,
    fileName: p.head.fileName,
    sizeBytes: p.head.sizeBytes,
    createdAt: p.head.createdAt,
    createdBy: p.head.createdBy,
    revision: { number: p.revision.number, createdAt: p.revision.createdAt, createdBy: p.revision.createdBy, comment: p.revision.comment },
    revisions: p.revisions.map(presentRevision),
    shots: p.shots,
  });
  const qcHead = JSON.stringify({ reciprocalToleranceMs: p.reciprocalToleranceMs, farPositions: p.far });
  const qc = `${qcHead.slice(0, -1)},${p.qcJson.trim().slice(1)}`;
  return `${rest.slice(0, -1)},"picks":${p.picksJson},"qc":${qc}}`;
}
