import type { ReactNode } from 'react';
import { Link, useParams } from 'react-router';
import { errorMessage, isApiError } from '../api/errors';
import { useProject } from '../api/projects';
import { useProjectReports, useReport } from '../api/reports';
import type { ProjectRole, ReportDetail, ReportSummary } from '../api/types';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { Section } from '../components/Section';
import { useSignedInUser } from '../components/meContext';
import { HistoryTimeline } from '../components/reports/HistoryTimeline';
import { PdfPanel } from '../components/reports/PdfPanel';
import { ReportCaution } from '../components/reports/ReportCaution';
import { ReportStatusBadge } from '../components/reports/ReportStatusBadge';
import { WorkflowPanel } from '../components/reports/WorkflowPanel';
import { dateTime, NEXT_FOR_CLIENT } from '../components/reports/wording';
import { isAdmin } from '../lib/permissions';

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-sm text-stone-600">{term}</dt>
      <dd className="font-semibold text-stone-900">{children}</dd>
    </div>
  );
}

/** A client asking for a report that is not shared (yet): say so plainly, with the way back. */
function NotShared({ error }: { error: unknown }) {
  return (
    <div role="alert" data-testid="report-not-shared" className="rounded-lg border border-stone-300 bg-white px-5 py-6">
      <title>Report not available · Timefield</title>
      <p className="text-lg font-semibold text-stone-900">This report is not available to you.</p>
      <p className="mt-1 text-stone-700">{errorMessage(error)} Reports appear on your project page once the project lead shares them.</p>
      <p className="mt-3">
        <Link to="/">Back to projects</Link>
      </p>
    </div>
  );
}

export function ReportPage() {
  const { reportId = '' } = useParams();
  const me = useSignedInUser();
  const report = useReport(reportId);
  const projectId = report.data?.projectId ?? '';
  const project = useProject(projectId, { enabled: Boolean(projectId) });
  // The list carries the line's name and the author, which the report itself does not.
  const list = useProjectReports(projectId);

  if (report.isPending) return <Loading what="report" />;
  if (report.isError) {
    // Only a client meets an unshared report; an administrator outside the project gets the general words.
    if (isApiError(report.error, 403) && !isAdmin(me)) return <NotShared error={report.error} />;
    return <LoadError error={report.error} what="report" onRetry={() => void report.refetch()} />;
  }

  const r = report.data;
  const role = me.projectRoles.find((g) => g.projectId === r.projectId)?.role ?? null;
  const summary = list.data?.find((x) => x.id === r.id);
  const title = summary ? `Report on line ${summary.line}` : 'Report';
  return (
    <>
      <title>{`${title} · Timefield`}</title>
      <PageHeader title={title} crumbs={[{ label: 'Projects', to: '/' }, { label: project.data?.name ?? 'Project', to: `/projects/${r.projectId}` }]}>
        <ReportFacts report={r} summary={summary} role={role} />
      </PageHeader>
      {role === 'client' ? <ClientView report={r} /> : <TeamView report={r} role={role} />}
    </>
  );
}

function ReportFacts({ report, summary, role }: { report: ReportDetail; summary: ReportSummary | undefined; role: ProjectRole | null }) {
  const team = role !== 'client';
  return (
    <dl data-testid="report-facts" className="flex flex-wrap gap-x-10 gap-y-3">
      <Fact term="Status">
        <ReportStatusBadge status={report.status} />
      </Fact>
      <Fact term="Prepared by">{summary ? (summary.createdBy ?? 'a former member') : '…'}</Fact>
      <Fact term="Started">{dateTime(report.createdAt)}</Fact>
      {team && (
        <>
          {report.options.shotId && <Fact term="Section drawn for shot">{report.options.shotId}</Fact>}
          <Fact term="Depth surface at">{`${report.options.isoVelocity.toLocaleString('en-GB')} m/s`}</Fact>
          <Fact term="From">
            {report.runId ? (
              <Link to={`/runs/${report.runId}`} data-testid="report-run-link">
                the forward run
              </Link>
            ) : report.lineId ? (
              <Link to={`/lines/${report.lineId}/inversions/${report.inversionId}`} data-testid="report-inversion-link">
                the inversion
              </Link>
            ) : (
              'an inversion'
            )}
          </Fact>
        </>
      )}
    </dl>
  );
}

function TeamView({ report, role }: { report: ReportDetail; role: ProjectRole | null }) {
  return (
    <>
      <div className="mb-8">
        <ReportCaution />
      </div>
      <div className="mb-10 grid grid-cols-1 items-start gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <PdfPanel report={report} />
        <WorkflowPanel report={report} role={role} />
      </div>
      {report.options.acquisitionNotes && (
        <Section title="Acquisition notes">
          <p className="max-w-prose whitespace-pre-wrap text-stone-800">{report.options.acquisitionNotes}</p>
        </Section>
      )}
      <Section title="History" description="Every step, who took it and when, with the comments given.">
        <HistoryTimeline events={report.history} />
      </Section>
    </>
  );
}

/** What a client sees: the PDF, the caution, and when it was shared (the team's names and review notes stay internal; the API leaves them out). */
function ClientView({ report }: { report: ReportDetail }) {
  const shared = [...report.history].reverse().find((e) => e.action === 'share');
  return (
    <>
      <div className="mb-8">
        <ReportCaution />
      </div>
      <div className="mb-10 grid grid-cols-1 items-start gap-6 lg:grid-cols-2">
        <PdfPanel report={report} forClient />
        <div className="rounded-lg border border-stone-200 bg-white p-5 shadow-xs">
          <h2 className="text-lg font-semibold text-stone-900">About this report</h2>
          <p className="mt-1 max-w-prose text-stone-700">{NEXT_FOR_CLIENT}</p>
          {shared && (
            <p data-testid="shared-by" className="mt-3 text-stone-700">
              Shared with you on {dateTime(shared.at)}.
            </p>
          )}
        </div>
      </div>
    </>
  );
}
