import { Fragment, useState } from 'react';
import { errorMessage } from '../api/errors';
import { useUpdateUser } from '../api/users';
import type { User, UserPatch } from '../api/types';
import { formatDate } from '../lib/format';
import { Button } from './Button';
import { ConfirmButton } from './ConfirmButton';
import { ResetPasswordForm } from './forms/ResetPasswordForm';
import { DataTable, Td, Th, Tr } from './Table';

/** All accounts, with the two changes an administrator makes most: role and active/inactive. */
export function AccountsTable({ users, myId }: { users: User[]; myId: string }) {
  const update = useUpdateUser();
  const sorted = [...users].sort((a, b) => Number(b.active) - Number(a.active) || a.name.localeCompare(b.name));
  const busyFor = (userId: string) => update.isPending && update.variables?.userId === userId;
  const change = (userId: string, patch: UserPatch) => update.mutate({ userId, patch });
  const [resetting, setResetting] = useState<string | null>(null);
  const [resetDone, setResetDone] = useState<string | null>(null);

  return (
    <>
      {resetDone && (
        <p role="status" className="mb-3 rounded-md bg-accent-50 px-4 py-2 text-accent-900">
          New password set for {resetDone}; they have been signed out everywhere.
        </p>
      )}
      {update.isError && (
        <p role="alert" className="mb-3 rounded-md border border-red-300 bg-red-50 px-4 py-2 text-red-900">
          {errorMessage(update.error)}
        </p>
      )}
      <DataTable caption="Accounts" testId="accounts-table" minWidth="52rem">
        <thead>
          <tr>
            <Th>Name</Th>
            <Th>E-mail</Th>
            <Th>Role</Th>
            <Th>Status</Th>
            <Th numeric>Created</Th>
            <Th>
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        <tbody>
          {sorted.map((u) => {
            const self = u.id === myId;
            const busy = busyFor(u.id);
            return (
              <Fragment key={u.id}>
              <Tr testId={`account-${u.email}`}>
                <Td className="font-semibold">
                  {u.name}
                  {self && <span className="ml-2 text-sm font-normal text-stone-500">(you)</span>}
                </Td>
                <Td className="text-stone-700">{u.email}</Td>
                <Td>{u.globalRole === 'admin' ? 'Administrator' : 'Standard'}</Td>
                <Td>{u.active ? 'Active' : <span className="font-semibold text-stone-500">Deactivated</span>}</Td>
                <Td numeric className="whitespace-nowrap text-stone-600">
                  {formatDate(u.createdAt)}
                </Td>
                <Td className="text-right whitespace-nowrap">
                  {self ? (
                    <span className="text-sm text-stone-500">Your own account</span>
                  ) : (
                    <span className="inline-flex justify-end gap-2">
                      <Button
                        variant="secondary"
                        size="sm"
                        aria-expanded={resetting === u.id}
                        onClick={() => {
                          setResetDone(null);
                          setResetting(resetting === u.id ? null : u.id);
                        }}
                      >
                        New password
                      </Button>
                      <ConfirmButton
                        label={u.globalRole === 'admin' ? 'Make standard' : 'Make administrator'}
                        confirmLabel={u.globalRole === 'admin' ? 'Confirm: make standard' : 'Confirm: make administrator'}
                        warning={
                          u.globalRole === 'admin'
                            ? `${u.name} will no longer manage accounts; their project roles stay as they are.`
                            : `${u.name} will be able to create, change and deactivate every account, and see every project.`
                        }
                        disabled={update.isPending}
                        busy={busy && update.variables?.patch.globalRole !== undefined}
                        busyLabel="Saving…"
                        testId={`account-role-${u.email}`}
                        onConfirm={(done) => update.mutate({ userId: u.id, patch: { globalRole: u.globalRole === 'admin' ? null : 'admin' } }, { onSettled: done })}
                      />
                      {u.active ? (
                        <ConfirmButton
                          label="Deactivate"
                          confirmLabel="Confirm: deactivate"
                          variant="danger"
                          warning={`${u.name} is signed out everywhere and cannot sign in until reactivated; their work stays.`}
                          disabled={update.isPending}
                          busy={busy && update.variables?.patch.active !== undefined}
                          busyLabel="Saving…"
                          testId={`account-active-${u.email}`}
                          onConfirm={(done) => update.mutate({ userId: u.id, patch: { active: false } }, { onSettled: done })}
                        />
                      ) : (
                        <Button variant="secondary" size="sm" disabled={update.isPending} aria-busy={busy || undefined} onClick={() => change(u.id, { active: true })}>
                          Reactivate
                        </Button>
                      )}
                    </span>
                  )}
                </Td>
              </Tr>
              {resetting === u.id && (
                <tr>
                  <td colSpan={6} className="bg-stone-50 px-4 py-3">
                    <ResetPasswordForm
                      user={u}
                      onSaved={() => {
                        setResetting(null);
                        setResetDone(u.name);
                      }}
                      onCancel={() => setResetting(null)}
                    />
                  </td>
                </tr>
              )}
              </Fragment>
            );
          })}
        </tbody>
      </DataTable>
    </>
  );
}
