import { useRef, useState, type FormEvent } from 'react';
import { useAddMember } from '../../api/projects';
import { useUserDirectory } from '../../api/users';
import type { ProjectMember, ProjectRole } from '../../api/types';
import { PROJECT_ROLES, ROLE_LABELS } from '../../lib/format';
import { formProblems, hasErrors, mergeFieldErrors, type FieldErrors } from '../../lib/formErrors';
import { Button } from '../Button';
import { SelectField } from '../Field';
import { FormAlert } from '../FormAlert';
import { LoadError } from '../LoadState';

const FIELDS = ['userId', 'role'] as const;

/** Choose an active account that is not yet on the project, and the role it gets. */
export function AddMemberForm({ projectId, members }: { projectId: string; members: ProjectMember[] }) {
  const directory = useUserDirectory();
  const add = useAddMember(projectId);
  const [userId, setUserId] = useState('');
  const [role, setRole] = useState<ProjectRole | ''>('');
  const [checks, setChecks] = useState<FieldErrors>({});
  const [added, setAdded] = useState<string | null>(null);
  const accountRef = useRef<HTMLSelectElement>(null);
  const roleRef = useRef<HTMLSelectElement>(null);

  if (directory.isError) return <LoadError error={directory.error} what="account directory" onRetry={() => void directory.refetch()} />;

  const memberIds = new Set(members.map((m) => m.userId));
  const candidates = (directory.data ?? []).filter((u) => !memberIds.has(u.id)).sort((a, b) => a.name.localeCompare(b.name));
  const problems = formProblems(add.error, FIELDS);
  const errors = mergeFieldErrors(problems.fields, checks);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    setAdded(null);
    const found: FieldErrors = {
      userId: userId ? undefined : 'Choose the account to add.',
      role: role ? undefined : 'Choose the role this person has on the project.',
    };
    setChecks(found);
    if (hasErrors(found) || !role) {
      add.reset();
      (found.userId ? accountRef : roleRef).current?.focus();
      return;
    }
    add.mutate(
      { userId, role },
      {
        onSuccess: (m) => {
          setAdded(`${m.name ?? 'The account'} was added as ${ROLE_LABELS[m.role] ?? m.role}.`);
          setUserId('');
          setRole('');
        },
      },
    );
  }

  return (
    <form noValidate onSubmit={onSubmit} data-testid="add-member-form" className="flex flex-col gap-4">
      <FormAlert problems={problems} />
      {added && (
        <p role="status" className="rounded-md bg-accent-50 px-4 py-2 text-accent-900">
          {added}
        </p>
      )}
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <SelectField
          label="Account"
          name="userId"
          value={userId}
          onChange={(e) => setUserId(e.target.value)}
          error={errors.userId}
          selectRef={accountRef}
          disabled={directory.isPending}
          hint={directory.data && candidates.length === 0 ? 'Every active account is already on this project.' : undefined}
        >
          <option value="">{directory.isPending ? 'Loading accounts…' : 'Choose an account'}</option>
          {candidates.map((u) => (
            <option key={u.id} value={u.id}>
              {u.name} ({u.email})
            </option>
          ))}
        </SelectField>
        <SelectField label="Role on this project" name="role" value={role} onChange={(e) => setRole(e.target.value as ProjectRole | '')} error={errors.role} selectRef={roleRef}>
          <option value="">Choose a role</option>
          {PROJECT_ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </SelectField>
      </div>
      <div>
        <Button type="submit" busy={add.isPending} busyLabel="Adding…">
          Add member
        </Button>
      </div>
    </form>
  );
}
