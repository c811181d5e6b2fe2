import type { Report } from '../entities';

export interface ReportEvent {
  at: Date;
  action: string;
  actor: string | null;
  comment: string;
}

/**
 * GET /api/reports/:reportId — state and history (never the PDF bytes). A client sees the state
 * and the dates of each step only: review comments and staff names stay internal.
 */
export function presentReport(r: Report, history: ReportEvent[], forClient: boolean) {
  const approvedReady = r.approvedPdfRenderedAt !== null;
  // Whether the report's line was in map coordinates when it was made: its GeoJSON can then be offered.
  const mapped = Boolean(r.snapshot?.crs && r.snapshot.stations.some((s) => s.easting !== undefined));
  if (forClient) {
    return {
      id: r.id,
      runId: r.runId,
      inversionId: r.inversionId,
      projectId: r.projectId,
      status: r.status,
      // Only the approved render exists for a client; a failed render is the staff's business.
      render: { state: approvedReady ? 'ready' : 'queued', renderedAt: r.approvedPdfRenderedAt },
      pdfReady: approvedReady,
      options: r.options,
      mapped,
      createdAt: r.createdAt,
      history: history.map(({ at, action }) => ({ at, action })),
    };
  }
  return {
    id: r.id,
    runId: r.runId,
    inversionId: r.inversionId,
    /** The line the report is about (staff links to the run or inversion page). */
    lineId: r.snapshot?.line.id ?? null,
    projectId: r.projectId,
    status: r.status,
    render: { state: r.renderState, error: r.renderError ?? undefined, renderedAt: r.pdfRenderedAt, approvedRenderedAt: r.approvedPdfRenderedAt },
    pdfReady: r.renderState === 'ready' || r.pdfRenderedAt !== null || approvedReady,
    options: r.options,
    mapped,
    createdAt: r.createdAt,
    history,
  };
}
