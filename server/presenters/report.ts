import type { Report } from '../entities';

export interface ReportEvent {
  at: Date;
  action: string;
  actor: string | null;
  comment: string;
}

/** GET /api/reports/:reportId — state and history (never the PDF bytes). */
export function presentReport(r: Report, history: ReportEvent[]) {
  return {
    id: r.id,
    runId: r.runId,
    projectId: r.projectId,
    status: r.status,
    render: { state: r.renderState, error: r.renderError ?? undefined, renderedAt: r.pdfRenderedAt },
    pdfReady: r.renderState === 'ready' || r.pdfRenderedAt !== null,
    options: r.options,
    createdAt: r.createdAt,
    history,
  };
}
