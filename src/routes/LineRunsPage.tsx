import { useParams } from 'react-router';
import { useProject } from '../api/projects';
import { useRunLine } from '../api/runs';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { LineRunsPanel } from '../components/run/line/LineRunsPanel';

/**
 * A line's forward runs on a page of their own (/lines/:lineId/runs): start a run, list and compare runs.
 * The line page can show the same LineRunsPanel in a tab instead.
 */
export function LineRunsPage() {
  const { lineId = '' } = useParams();
  const line = useRunLine(lineId);
  const project = useProject(line.data?.projectId ?? '', { enabled: Boolean(line.data?.projectId) });
  if (line.isPending) return <Loading what="survey line" />;
  if (line.isError) return <LoadError error={line.error} what="survey line" onRetry={() => void line.refetch()} />;
  return (
    <>
      <title>{`Runs · ${line.data.name} · Timefield`}</title>
      <PageHeader
        title={`Forward runs of ${line.data.name}`}
        crumbs={[
          { label: 'Projects', to: '/' },
          { label: project.data?.name ?? 'Project', to: `/projects/${line.data.projectId}` },
          { label: line.data.name, to: `/lines/${line.data.id}` },
        ]}
      />
      <LineRunsPanel line={line.data} />
    </>
  );
}

export default LineRunsPage;
