/**
 * Every job kind has a database row that says how its work stands (ARCHITECTURE.md, "Every job
 * kind has the same life"). This table says, per job name, which row a job belongs to and how to
 * mark that row failed; the worker's failure handler and the reconciler use it for every kind alike.
 * A new job kind adds one entry here.
 */
import { dataSource } from '../../server/db/dataSource';
import { combineWhenComplete } from '../processors/ensembleCombine';

export interface JobRowKind {
  /** The row's id from the job's data. */
  rowIdOf(data: unknown): string | undefined;
  /** Rows still waiting or working, older than `graceSeconds` (a row is written just before its job is queued). */
  unfinishedRows(graceSeconds: number): Promise<string[]>;
  /** Marks the row failed with a reason a user understands; a row that already finished is left alone. */
  markFailed(rowId: string, reason: string): Promise<void>;
}

const idField = (field: string) => (data: unknown) => {
  const v = (data as Record<string, unknown> | null)?.[field];
  return typeof v === 'string' ? v : undefined;
};

export const jobRows: Record<string, JobRowKind> = {
  solve: {
    rowIdOf: idField('runId'),
    async unfinishedRows(grace) {
      const rows = await dataSource.query(
        `SELECT id FROM runs WHERE status IN ('queued', 'running') AND coalesce(started_at, created_at) < now() - make_interval(secs => $1)`,
        [grace],
      );
      return rows.map((r: { id: string }) => r.id);
    },
    async markFailed(id, reason) {
      await dataSource.query(`UPDATE runs SET status = 'failed', error = $2, finished_at = now() WHERE id = $1 AND status IN ('queued', 'running')`, [id, reason]);
    },
  },
  invert: {
    rowIdOf: idField('inversionId'),
    async unfinishedRows(grace) {
      const rows = await dataSource.query(
        `SELECT id FROM inversions WHERE status IN ('queued', 'running') AND coalesce(started_at, created_at) < now() - make_interval(secs => $1)`,
        [grace],
      );
      return rows.map((r: { id: string }) => r.id);
    },
    async markFailed(id, reason) {
      await dataSource.query(`UPDATE inversions SET status = 'failed', error = $2, finished_at = now() WHERE id = $1 AND status IN ('queued', 'running')`, [id, reason]);
    },
  },
  // A member's row is named "<ensemble id>/<index>"; marking it failed may complete its ensemble.
  'ensemble-member': {
    rowIdOf: (data) => {
      const d = data as { ensembleId?: unknown; index?: unknown } | null;
      return typeof d?.ensembleId === 'string' && Number.isInteger(d.index) ? `${d.ensembleId}/${d.index}` : undefined;
    },
    async unfinishedRows(grace) {
      const rows = await dataSource.query(
        `SELECT m.ensemble_id, m.index FROM ensemble_members m JOIN ensembles e ON e.id = m.ensemble_id
         WHERE m.status IN ('queued', 'running') AND coalesce(m.started_at, e.created_at) < now() - make_interval(secs => $1)`,
        [grace],
      );
      return rows.map((r: { ensemble_id: string; index: number }) => `${r.ensemble_id}/${r.index}`);
    },
    async markFailed(id, reason) {
      const [ensembleId, index] = id.split('/');
      await dataSource.query(
        `UPDATE ensemble_members SET status = 'failed', error = $3, finished_at = now() WHERE ensemble_id = $1 AND index = $2 AND status IN ('queued', 'running')`,
        [ensembleId, Number(index), reason],
      );
      await combineWhenComplete(ensembleId);
    },
  },
  report: {
    rowIdOf: idField('reportId'),
    async unfinishedRows(grace) {
      const rows = await dataSource.query(
        `SELECT id FROM reports WHERE render_state IN ('queued', 'rendering') AND created_at < now() - make_interval(secs => $1)`,
        [grace],
      );
      return rows.map((r: { id: string }) => r.id);
    },
    async markFailed(id, reason) {
      await dataSource.query(`UPDATE reports SET render_state = 'failed', render_error = $2 WHERE id = $1 AND render_state IN ('queued', 'rendering')`, [id, reason]);
    },
  },
};

/** The words a user sees for a job that failed for good. */
export function failureReason(err: string | undefined): string {
  const why = err?.trim() || 'no reason was recorded';
  if (/stalled more than allowable limit/.test(why)) {
    return 'The job was stopped: the worker running it stopped responding several times (killed or out of memory). Start it again; if it happens again, the model may be too large for the worker.';
  }
  if (/ECONNREFUSED|ECONNRESET|Connection terminated|terminating connection/i.test(why)) {
    return `The job was stopped because the database could not be reached (${why}). Start it again.`;
  }
  return why.startsWith('The ') ? why : `The job failed: ${why}`;
}
