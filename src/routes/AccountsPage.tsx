import { useState } from 'react';
import { useUsers } from '../api/users';
import type { User } from '../api/types';
import { AccountsTable } from '../components/AccountsTable';
import { Disclosure } from '../components/Disclosure';
import { NewAccountForm } from '../components/forms/NewAccountForm';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { Panel } from '../components/Panel';
import { useSignedInUser } from '../components/meContext';
import { plural } from '../lib/format';
import { isAdmin } from '../lib/permissions';
import { NotFoundPage } from './NotFoundPage';

export function AccountsPage() {
  const me = useSignedInUser();
  // Non-admins get the 404 page and never send the request (the API would answer 403).
  if (!isAdmin(me)) return <NotFoundPage />;
  return <AccountsPageContent myId={me.id} />;
}

function AccountsPageContent({ myId }: { myId: string }) {
  const users = useUsers();
  const [created, setCreated] = useState<User | null>(null);
  const activeCount = users.data?.filter((u) => u.active).length ?? 0;

  return (
    <>
      <title>Accounts · Timefield</title>
      <PageHeader title="Accounts">
        Everyone who can sign in to Timefield.
        {users.data && ` ${plural(users.data.length, 'account')}, ${activeCount} active.`} Deactivated accounts cannot sign in but keep
        their history.
      </PageHeader>

      <div className="mb-8">
        {created && (
          <p role="status" className="mb-4 rounded-md bg-accent-50 px-4 py-2 text-accent-900">
            Account created for {created.name} ({created.email}). Add them to projects from each project page.
          </p>
        )}
        <Disclosure label="New account" testId="new-account-toggle">
          {(close) => (
            <Panel title="New account">
              <NewAccountForm
                onCreated={(u) => {
                  setCreated(u);
                  close();
                }}
              />
            </Panel>
          )}
        </Disclosure>
      </div>

      {users.isPending && <Loading what="accounts" />}
      {users.isError && <LoadError error={users.error} what="account list" onRetry={() => void users.refetch()} />}
      {users.data && <AccountsTable users={users.data} myId={myId} />}
    </>
  );
}
