import { useParams } from 'react-router';
import { useLine } from '../api/lines';
import { useProject } from '../api/projects';
import { EmptyState } from '../components/EmptyState';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { Section } from '../components/Section';
import { formatDate, plural } from '../lib/format';

/**
 * What a line will hold. Uploads, editing and runs come with later work, so each block
 * says plainly that it is empty rather than pretending to offer what does not exist yet.
 */
const BLOCKS = [
  {
    key: 'stations',
    title: 'Stations',
    empty: 'No station geometry uploaded yet',
    detail: 'The station table gives each geophone and shot point its chainage and elevation.',
    noun: 'station',
  },
  {
    key: 'pickSets',
    title: 'Pick sets',
    empty: 'No pick sets uploaded yet',
    detail: 'A pick set holds the first-arrival travel times picked for every shot on this line.',
    noun: 'pick set',
  },
  {
    key: 'models',
    title: 'Velocity models',
    empty: 'No velocity models saved yet',
    detail: 'Each saved model is kept as its own version, so every run can be reproduced.',
    noun: 'model version',
  },
  {
    key: 'runs',
    title: 'Runs',
    empty: 'No runs yet',
    detail: 'A run computes travel times through a model and compares them with the picks (RMS misfit).',
    noun: 'run',
  },
] as const;

export function LinePage() {
  const { lineId = '' } = useParams();
  const line = useLine(lineId);
  // The project name for the breadcrumb; the project page has usually cached it already.
  const project = useProject(line.data?.projectId ?? '', { enabled: Boolean(line.data?.projectId) });

  if (line.isPending) return <Loading what="survey line" />;
  if (line.isError) return <LoadError error={line.error} what="survey line" onRetry={() => void line.refetch()} />;

  const l = line.data;
  return (
    <>
      <title>{`${l.name} · Timefield`}</title>
      <PageHeader
        title={l.name}
        crumbs={[
          { label: 'Projects', to: '/' },
          { label: project.data?.name ?? 'Project', to: `/projects/${l.projectId}` },
        ]}
      >
        <p className="text-sm text-stone-600">Created {formatDate(l.createdAt)}</p>
        <div data-testid="line-notes" className="mt-3 max-w-prose whitespace-pre-line">
          {l.notes ? l.notes : <span className="text-stone-500">No notes for this line.</span>}
        </div>
      </PageHeader>

      <div className="grid gap-x-8 md:grid-cols-2">
        {BLOCKS.map((b) => {
          const items = Array.isArray(l[b.key]) ? l[b.key] : [];
          return (
            <Section key={b.key} title={b.title}>
              {items.length === 0 ? (
                <EmptyState title={b.empty} testId={`${b.key}-empty`}>
                  {b.detail}
                </EmptyState>
              ) : (
                <p data-testid={`${b.key}-count`} className="rounded-lg border border-stone-200 bg-white px-5 py-4">
                  {plural(items.length, b.noun)} on record.
                </p>
              )}
            </Section>
          );
        })}
      </div>
    </>
  );
}
