import { useProject } from '../../api/projects';
import type { LineDetail, LineRunSummary, RunDetail } from '../../api/types';
import { PageHeader, type Crumb } from '../PageHeader';
import { duration, ORDER_LABELS, when } from './format';
import { RunStatusBadge } from './RunStatusBadge';

/** Title, the way back to the line, and what exactly was solved (model version, pick set revision, order). */
export function RunHeader({ run, line, summary, title, extraCrumbs = [] }: { run: RunDetail; line: LineDetail | undefined; summary: LineRunSummary | undefined; title?: string; extraCrumbs?: Crumb[] }) {
  const project = useProject(line?.projectId ?? '', { enabled: Boolean(line?.projectId) });
  const modelName = summary ? `${summary.model.name} v${summary.model.version}` : 'model';
  const took = duration(run.startedAt, run.finishedAt);
  return (
    <PageHeader
      title={title ?? `Forward run: ${modelName}`}
      crumbs={[
        { label: 'Projects', to: '/' },
        { label: project.data?.name ?? 'Project', to: line ? `/projects/${line.projectId}` : undefined },
        { label: line?.name ?? 'Line', to: `/lines/${run.lineId}` },
        ...extraCrumbs,
      ]}
    >
      <p className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <RunStatusBadge status={run.status} />
        <span>
          Model <strong>{modelName}</strong> against picks <strong>{summary?.pickSet.fileName ?? 'pick set'}</strong> revision {run.pickSetRevision},{' '}
          {ORDER_LABELS[run.order]} solver
        </span>
      </p>
      <p className="mt-1 text-sm text-stone-600">
        Started {when(run.createdAt)}
        {summary?.createdBy && <> by {summary.createdBy}</>}
        {took && <> · {run.status === 'done' ? 'finished' : 'stopped'} {took} after a worker took it up (reading, solving, rays and storing; the solve alone is under Summary)</>}
      </p>
    </PageHeader>
  );
}
