import { useState } from 'react';
import { errorMessage } from '../api/errors';
import { useRemoveMember } from '../api/projects';
import type { ProjectMember } from '../api/types';
import { ROLE_LABELS } from '../lib/format';
import { Button } from './Button';
import { MemberRoleEditor } from './MemberRoleEditor';
import { DataTable, Td, Th, Tr } from './Table';

/** Members of a project; leads and admins change a member's role in place, or remove them with a second click to confirm. */
export function MembersTable({ projectId, members, canManage, myId }: { projectId: string; members: ProjectMember[]; canManage: boolean; myId: string }) {
  const remove = useRemoveMember(projectId);
  const [confirming, setConfirming] = useState<string | null>(null);
  const [editing, setEditing] = useState<string | null>(null);
  const sorted = [...members].sort((a, b) => a.name.localeCompare(b.name));

  return (
    <>
      {remove.isError && (
        <p role="alert" className="mb-3 rounded-md border border-red-300 bg-red-50 px-4 py-2 text-red-900">
          {errorMessage(remove.error)}
        </p>
      )}
      <DataTable caption="Project members" testId="members-table" minWidth="34rem">
        <thead>
          <tr>
            <Th>Name</Th>
            <Th>E-mail</Th>
            <Th>Role</Th>
            {canManage && (
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            )}
          </tr>
        </thead>
        <tbody>
          {sorted.map((m) => (
            <Tr key={m.userId} testId={`member-${m.email}`}>
              <Td className="font-semibold">
                {m.name}
                {m.userId === myId && <span className="ml-2 text-sm font-normal text-stone-500">(you)</span>}
              </Td>
              <Td className="text-stone-700">{m.email}</Td>
              <Td>{ROLE_LABELS[m.role] ?? m.role}</Td>
              {canManage && (
                <Td className="text-right whitespace-nowrap">
                  {editing === m.userId ? (
                    <MemberRoleEditor projectId={projectId} member={m} onDone={() => setEditing(null)} />
                  ) : m.userId === myId ? (
                    <Button variant="secondary" size="sm" onClick={() => setEditing(m.userId)} aria-label="Change your own role in the project">
                      Change role
                    </Button>
                  ) : confirming === m.userId ? (
                    <span className="inline-flex gap-2">
                      <Button
                        variant="danger"
                        size="sm"
                        busy={remove.isPending && remove.variables === m.userId}
                        busyLabel="Removing…"
                        onClick={() => remove.mutate(m.userId, { onSettled: () => setConfirming(null) })}
                      >
                        Confirm removal
                      </Button>
                      <Button variant="quiet" size="sm" onClick={() => setConfirming(null)} disabled={remove.isPending}>
                        Keep
                      </Button>
                    </span>
                  ) : (
                    <span className="inline-flex gap-2">
                      <Button variant="secondary" size="sm" onClick={() => setEditing(m.userId)} aria-label={`Change the role of ${m.name}`} data-testid={`member-role-${m.email}`}>
                        Change role
                      </Button>
                      <Button variant="secondary" size="sm" onClick={() => setConfirming(m.userId)} disabled={remove.isPending} aria-label={`Remove ${m.name} from the project`}>
                        Remove
                      </Button>
                    </span>
                  )}
                </Td>
              )}
            </Tr>
          ))}
        </tbody>
      </DataTable>
    </>
  );
}
