import { useProject } from '../../api/projects';
import type { LineDetail } from '../../api/types';
import type { InversionView } from '../../../shared/schemas/inversions';
import { PageHeader, type Crumb } from '../PageHeader';
import { duration, when } from '../run/format';
import { InversionStatusBadge } from './InversionStatusBadge';
import { startWords } from './wording';

/** An inversion's title, the way back to the line, and exactly what was inverted. */
export function inversionTitle(inv: Pick<InversionView, 'label' | 'createdAt'>): string {
  return inv.label ? inv.label : `Inversion of ${when(inv.createdAt)}`;
}

export function InversionHeader({ inversion, line, title, extraCrumbs = [] }: { inversion: InversionView; line: LineDetail | undefined; title?: string; extraCrumbs?: Crumb[] }) {
  const project = useProject(line?.projectId ?? '', { enabled: Boolean(line?.projectId) });
  const pickSet = line?.pickSets.find((p) => p.id === inversion.pickSetId);
  const took = duration(inversion.startedAt, inversion.finishedAt);
  const { grid } = inversion;
  return (
    <PageHeader
      title={title ?? inversionTitle(inversion)}
      crumbs={[
        { label: 'Projects', to: '/' },
        { label: project.data?.name ?? 'Project', to: line ? `/projects/${line.projectId}` : undefined },
        { label: line?.name ?? 'Line', to: `/lines/${inversion.lineId}?tab=inversions` },
        ...extraCrumbs,
      ]}
    >
      <p className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <InversionStatusBadge status={inversion.status} />
        <span>
          Picks <strong>{pickSet?.fileName ?? 'pick set'}</strong> revision {inversion.pickSetRevision}, from {startWords(inversion.start).replace(/^./, (c) => c.toLowerCase())}, on{' '}
          {grid.nx} × {grid.nz} nodes of {grid.dx} m
        </span>
      </p>
      <p className="mt-1 text-sm text-stone-600">
        Started {when(inversion.createdAt)}
        {took && <> · {inversion.status === 'done' ? 'finished' : 'stopped'} in {took}</>}
      </p>
    </PageHeader>
  );
}
