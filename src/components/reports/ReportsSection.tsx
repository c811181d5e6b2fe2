import { useProjectReports } from '../../api/reports';
import type { ProjectDetail } from '../../api/types';
import { EmptyState } from '../EmptyState';
import { LoadError } from '../LoadState';
import { Section } from '../Section';
import { ClientReportsTable, TeamReportsTable } from './ReportsTable';

/**
 * The project's reports. For a client this is the page's main content: the reports the lead
 * has shared, each with its download. The team sees every report and its review status.
 */
export function ReportsSection({ project }: { project: ProjectDetail }) {
  const role = project.myRole;
  const reports = useProjectReports(project.id, { enabled: role !== null });
  const client = role === 'client';
  const title = client ? 'Reports shared with you' : 'Reports';
  const description = client
    ? 'Reviewed and approved reports on this site. Each PDF states its method, its limits and who reviewed it.'
    : 'PDF summaries of finished runs and where each stands in review. A report is started from a finished run’s page.';

  if (role === null) {
    return (
      <Section title="Reports">
        <EmptyState title="Reports are open to project members" testId="reports-members-only">
          Add yourself to the project to read its reports; the audit trail records every step taken on them.
        </EmptyState>
      </Section>
    );
  }

  return (
    <Section title={title} description={description}>
      {reports.isPending && (
        <p role="status" className="text-stone-600">
          Loading reports…
        </p>
      )}
      {reports.isError && <LoadError error={reports.error} what="report list" onRetry={() => void reports.refetch()} />}
      {reports.data && reports.data.length === 0 && (
        <EmptyState title={client ? 'No reports shared with you yet' : 'No reports yet'} testId="reports-empty">
          {client
            ? 'When the project lead has approved a report and shared it with you, it appears here and you are told by e-mail.'
            : 'Open a finished run of one of this project’s lines and start a report from it.'}
        </EmptyState>
      )}
      {reports.data && reports.data.length > 0 && (client ? <ClientReportsTable reports={reports.data} /> : <TeamReportsTable reports={reports.data} />)}
    </Section>
  );
}
