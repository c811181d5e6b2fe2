import { useState } from 'react';
import { errorMessage } from '../api/errors';
import { useChangeMemberRole } from '../api/projects';
import type { ProjectMember, ProjectRole } from '../api/types';
import { ROLE_LABELS } from '../lib/format';
import { Button } from './Button';

/** What a role may do, in a line, so the change is made knowingly. */
const ROLE_MEANS: Record<ProjectRole, string> = {
  lead: 'manages members, starts runs, approves and shares reports',
  geophysicist: 'interprets, edits models, starts runs and inversions, writes reports',
  field_tech: 'enters stations, uploads picks and records, reads results',
  client: 'sees shared reports only, no field data',
};

/** A member's role changed in place: choose, read what it means, save. */
export function MemberRoleEditor({ projectId, member, onDone }: { projectId: string; member: ProjectMember; onDone: () => void }) {
  const change = useChangeMemberRole(projectId);
  const [role, setRole] = useState<ProjectRole>(member.role);
  return (
    <span role="group" aria-label={`Role of ${member.name}`} className="inline-flex flex-wrap items-center justify-end gap-2 whitespace-normal">
      <select
        aria-label={`New role for ${member.name}`}
        value={role}
        onChange={(e) => setRole(e.target.value as ProjectRole)}
        data-testid={`member-role-select-${member.email}`}
        className="rounded-md border border-stone-300 bg-white px-2 py-1 text-sm"
      >
        {(Object.keys(ROLE_LABELS) as ProjectRole[]).map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r]}
          </option>
        ))}
      </select>
      <span className="max-w-xs text-left text-sm text-stone-700">{ROLE_MEANS[role]}</span>
      <Button
        size="sm"
        disabled={role === member.role}
        busy={change.isPending}
        busyLabel="Saving…"
        data-testid={`member-role-save-${member.email}`}
        onClick={() => change.mutate({ userId: member.userId, role }, { onSuccess: onDone })}
      >
        Save role
      </Button>
      <Button variant="quiet" size="sm" onClick={onDone} disabled={change.isPending}>
        Cancel
      </Button>
      {change.isError && (
        <span role="alert" className="w-full text-right text-sm font-semibold text-red-800">
          {errorMessage(change.error)}
        </span>
      )}
    </span>
  );
}
