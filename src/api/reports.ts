import { useSubmissionKey } from './submissionKey';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from './client';
import { adminKeys, reportKeys } from './keys';
import type { ReportDetail, ReportRenderState, ReportSource, ReportStep, ReportStepResult, ReportSummary, StartReportBody } from './types';

const reportPath = (reportId: string) => `/api/reports/${encodeURIComponent(reportId)}`;

/** The PDF's address: a plain same-origin GET that carries the session cookie, so a link downloads it. */
export const reportPdfUrl = (reportId: string) => `${reportPath(reportId)}/pdf`;

/** A PDF waiting for the worker or being drawn; worth asking about again soon. */
export const isRendering = (state: ReportRenderState | undefined): boolean => state === 'queued' || state === 'rendering';

/** How often a report whose PDF is being made is asked again (ms). A demo report takes a few seconds. */
const RENDER_POLL_MS = 1500;

/** The project's reports (a client gets only the shared ones), polled while any PDF is being made. */
export function useProjectReports(projectId: string, options: { enabled?: boolean } = {}) {
  return useQuery({
    queryKey: reportKeys.list(projectId),
    queryFn: ({ signal }) => apiRequest<ReportSummary[]>(`/api/projects/${encodeURIComponent(projectId)}/reports`, { signal }),
    enabled: Boolean(projectId) && (options.enabled ?? true),
    refetchInterval: (q) => (q.state.data?.some((r) => isRendering(r.renderState)) ? RENDER_POLL_MS : false),
  });
}

/** One report with its history, polled while its PDF is queued or rendering. */
export function useReport(reportId: string) {
  return useQuery({
    queryKey: reportKeys.report(reportId),
    queryFn: ({ signal }) => apiRequest<ReportDetail>(reportPath(reportId), { signal }),
    enabled: Boolean(reportId),
    refetchInterval: (q) => (isRendering(q.state.data?.render.state) ? RENDER_POLL_MS : false),
  });
}

/** One workflow step (submit, approve, return, share) with an optional comment; return needs one. */
export function useReportStep(reportId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ step, comment }: { step: ReportStep; comment: string }) =>
      apiRequest<ReportStepResult>(`${reportPath(reportId)}/${step}`, { method: 'POST', body: comment ? { comment } : {} }),
    onSuccess: async (result) => {
      const { mailed: _mailed, mailError: _mailError, ...report } = result;
      queryClient.setQueryData<ReportDetail>(reportKeys.report(reportId), report);
      await queryClient.invalidateQueries({ queryKey: reportKeys.list(result.projectId) });
      await queryClient.invalidateQueries({ queryKey: adminKeys.audit(result.projectId) });
    },
    // "Not allowed now" usually means someone else moved the report on: show its real state.
    onError: () => queryClient.invalidateQueries({ queryKey: reportKeys.report(reportId) }),
  });
}

/** Start a report of a finished run or inversion (geophysicist, lead); the worker renders its PDF. */
export function useStartReport(source: ReportSource) {
  const queryClient = useQueryClient();
  const submission = useSubmissionKey();
  const path = 'runId' in source ? `/api/runs/${encodeURIComponent(source.runId)}/reports` : `/api/inversions/${encodeURIComponent(source.inversionId)}/reports`;
  return useMutation({
    mutationFn: (body: StartReportBody) => apiRequest<{ id: string }>(path, { method: 'POST', body, idempotencyKey: submission.current() }),
    onSettled: submission.renew,
    // The new draft belongs to some project's list; refresh every list rather than guess which.
    onSuccess: () => queryClient.invalidateQueries({ predicate: (q) => q.queryKey[0] === 'projects' && q.queryKey[2] === 'reports' }),
  });
}
