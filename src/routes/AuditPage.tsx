import { useDeferredValue, useId, useState } from 'react';
import { useParams } from 'react-router';
import { useAuditTrail } from '../api/admin';
import { useProject } from '../api/projects';
import { EmptyState } from '../components/EmptyState';
import { TextField } from '../components/Field';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { useSignedInUser } from '../components/meContext';
import { AUDIT_ACTION_LABELS, AuditTable } from '../components/reports/AuditTable';
import { plural } from '../lib/format';
import { isAdmin } from '../lib/permissions';
import { NotFoundPage } from './NotFoundPage';

/** The audit trail of one project, for its lead and for administrators. */
export function AuditPage() {
  const { projectId = '' } = useParams();
  const me = useSignedInUser();
  const role = me.projectRoles.find((g) => g.projectId === projectId)?.role ?? null;
  // Others get the 404 page and never send the request (the API would refuse it).
  if (!isAdmin(me) && role !== 'lead') return <NotFoundPage />;
  return <AuditContent projectId={projectId} linkable={role !== null && role !== 'client'} />;
}

function AuditContent({ projectId, linkable }: { projectId: string; linkable: boolean }) {
  const project = useProject(projectId);
  const trail = useAuditTrail(projectId);
  const [filter, setFilter] = useState('');
  const listId = useId();
  const needle = useDeferredValue(filter.trim().toLowerCase());
  const all = trail.data ?? [];
  const shown = all.filter((e) => !needle || e.action.toLowerCase().includes(needle) || (AUDIT_ACTION_LABELS[e.action] ?? '').toLowerCase().includes(needle));
  const actions = [...new Set(all.map((e) => e.action))].sort();
  const name = project.data?.name ?? 'Project';

  return (
    <>
      <title>{`Audit trail · ${name} · Timefield`}</title>
      <PageHeader title="Audit trail" crumbs={[{ label: 'Projects', to: '/' }, { label: name, to: `/projects/${projectId}` }]}>
        Who did what on this project, to which object and when, newest first. Entries are written with each change and never edited.
      </PageHeader>

      {trail.isPending && <Loading what="audit trail" />}
      {trail.isError && <LoadError error={trail.error} what="audit trail" onRetry={() => void trail.refetch()} />}
      {trail.data && trail.data.length === 0 && <EmptyState title="Nothing recorded yet" testId="audit-empty" />}
      {trail.data && trail.data.length > 0 && (
        <>
          <div className="mb-4 flex flex-wrap items-end gap-4">
            <div className="w-full max-w-sm">
              <TextField
                label="Filter by action"
                type="search"
                list={listId}
                hint="For example “report”, “approved” or “run.start”."
                value={filter}
                onChange={(e) => setFilter(e.target.value)}
                data-testid="audit-filter"
              />
              <datalist id={listId}>
                {actions.map((a) => (
                  <option key={a} value={a} />
                ))}
              </datalist>
            </div>
            <p role="status" className="pb-7 text-stone-600">
              {needle ? `Showing ${shown.length} of ${plural(all.length, 'entry', 'entries')}.` : `${plural(all.length, 'entry', 'entries')}.`}
            </p>
          </div>
          {shown.length > 0 ? (
            <AuditTable entries={shown} linkable={linkable} />
          ) : (
            <EmptyState title="No entry matches this action" testId="audit-no-match">
              Clear the filter to see every entry.
            </EmptyState>
          )}
        </>
      )}
    </>
  );
}
