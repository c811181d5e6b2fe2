import { useDeferredValue, useState } from 'react';
import { useOutbox } from '../api/admin';
import { EmptyState } from '../components/EmptyState';
import { TextField } from '../components/Field';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { useSignedInUser } from '../components/meContext';
import { OutboxTable } from '../components/reports/OutboxTable';
import { plural } from '../lib/format';
import { isAdmin } from '../lib/permissions';
import { NotFoundPage } from './NotFoundPage';

export function OutboxPage() {
  const me = useSignedInUser();
  // Non-admins get the 404 page and never send the request (the API would answer 403).
  if (!isAdmin(me)) return <NotFoundPage />;
  return <OutboxContent />;
}

function OutboxContent() {
  const outbox = useOutbox();
  const [filter, setFilter] = useState('');
  const needle = useDeferredValue(filter.trim().toLowerCase());
  const shown = (outbox.data ?? []).filter(
    (m) => !needle || m.subject.toLowerCase().includes(needle) || m.to.some((t) => t.toLowerCase().includes(needle)) || m.from.toLowerCase().includes(needle),
  );

  return (
    <>
      <title>Mail outbox · Timefield</title>
      <PageHeader title="Mail outbox">
        Every e-mail Timefield has sent, as the mail server received it: review requests, verdicts and reports shared with clients.
        {outbox.data && ` ${plural(outbox.data.length, 'message')}.`} Open a subject to read the message.
      </PageHeader>

      {outbox.isPending && <Loading what="outbox" />}
      {outbox.isError && <LoadError error={outbox.error} what="outbox" onRetry={() => void outbox.refetch()} />}
      {outbox.data && outbox.data.length === 0 && (
        <EmptyState title="No mail sent yet" testId="outbox-empty">
          Messages appear here when a report is submitted, approved, returned or shared.
        </EmptyState>
      )}
      {outbox.data && outbox.data.length > 0 && (
        <>
          <div className="mb-4 flex flex-wrap items-end gap-4">
            <div className="w-full max-w-sm">
              <TextField label="Find" type="search" hint="Part of a subject or an address." value={filter} onChange={(e) => setFilter(e.target.value)} />
            </div>
            <div className="flex gap-3 pb-7">
              <p role="status" className="text-stone-600">
                {needle ? `Showing ${shown.length} of ${plural(outbox.data.length, 'message')}.` : ''}
              </p>
              <button type="button" onClick={() => void outbox.refetch()} className="font-semibold text-accent-700 underline underline-offset-3">
                {outbox.isFetching ? 'Checking…' : 'Check for new mail'}
              </button>
            </div>
          </div>
          {shown.length > 0 ? <OutboxTable messages={shown} /> : <EmptyState title="No message matches" />}
        </>
      )}
    </>
  );
}
