import { dataSource } from '../db/dataSource';
import { Report } from '../entities';
import { HttpError } from '../http/errors';
import type { ReportEvent } from '../presenters/report';

export async function getReport(id: string): Promise<Report> {
  const report = await dataSource.getRepository(Report).findOneBy({ id });
  if (!report) throw new HttpError(404, 'not_found', 'Not found.');
  return report;
}

/** Who did what to the report, from the audit trail. */
export async function reportHistory(id: string): Promise<ReportEvent[]> {
  const rows = await dataSource.query(
    `SELECT a.at, a.action, u.name AS actor, coalesce(a.detail->>'comment', '') AS comment
     FROM audit_log a LEFT JOIN users u ON u.id = a.actor_id WHERE a.object_type = 'report' AND a.object_id = $1 ORDER BY a.id`,
    [id],
  );
  return rows.map((r: ReportEvent) => ({ at: r.at, action: r.action.replace(/^report\./, ''), actor: r.actor, comment: r.comment }));
}

/** The PDF to hand out: the approved render once it exists; the draft only to staff (`approvedOnly` false). */
export async function loadPdf(id: string, approvedOnly: boolean): Promise<Buffer | null> {
  const [row] = await dataSource.query('SELECT pdf, approved_pdf FROM reports WHERE id = $1', [id]);
  if (!row) return null;
  return row.approved_pdf ?? (approvedOnly ? null : row.pdf);
}

/** Reports of a project, newest first; `sharedOnly` for clients. */
export async function listProjectReports(projectId: string, sharedOnly: boolean) {
  const rows = await dataSource.query(
    `SELECT r.id, r.status, r.render_state, r.created_at, r.run_id, r.inversion_id, l.name AS line, u.name AS created_by
     FROM reports r LEFT JOIN runs x ON x.id = r.run_id LEFT JOIN inversions i ON i.id = r.inversion_id
     JOIN survey_lines l ON l.id = COALESCE(x.line_id, i.line_id) LEFT JOIN users u ON u.id = r.created_by
     WHERE r.project_id = $1 ${sharedOnly ? `AND r.status = 'shared'` : ''} ORDER BY r.created_at DESC`,
    [projectId],
  );
  return rows.map((r: Record<string, never>) => ({
    id: r.id, status: r.status, renderState: r.render_state, createdAt: r.created_at, runId: r.run_id, inversionId: r.inversion_id, line: r.line, createdBy: sharedOnly ? null : r.created_by, // clients see no staff names
  }));
}
