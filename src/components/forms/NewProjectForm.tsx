import { useRef, useState, type FormEvent } from 'react';
import { useCreateProject } from '../../api/projects';
import type { ProjectStatus, ProjectSummary } from '../../api/types';
import { PROJECT_STATUSES, STATUS_LABELS } from '../../lib/format';
import { formProblems, hasErrors, mergeFieldErrors, type FieldErrors } from '../../lib/formErrors';
import { Button } from '../Button';
import { SelectField, TextField } from '../Field';
import { FormAlert } from '../FormAlert';

const FIELDS = ['name', 'site', 'clientOrganisation', 'status'] as const;

export function NewProjectForm({ onCreated }: { onCreated: (project: ProjectSummary) => void }) {
  const create = useCreateProject();
  const [name, setName] = useState('');
  const [site, setSite] = useState('');
  const [clientOrganisation, setClientOrganisation] = useState('');
  const [status, setStatus] = useState<ProjectStatus>('active');
  const [checks, setChecks] = useState<FieldErrors>({});
  const firstRef = useRef<HTMLInputElement>(null);

  const problems = formProblems(create.error, FIELDS);
  const errors = mergeFieldErrors(problems.fields, checks);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const found: FieldErrors = {
      name: name.trim() ? undefined : 'Give the project a name.',
      site: site.trim() ? undefined : 'Name the site (for example the scheme or the road and chainage).',
      clientOrganisation: clientOrganisation.trim() ? undefined : 'Name the client organisation.',
    };
    setChecks(found);
    if (hasErrors(found)) {
      create.reset();
      firstRef.current?.form?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus();
      return;
    }
    create.mutate(
      { name: name.trim(), site: site.trim(), clientOrganisation: clientOrganisation.trim(), status },
      { onSuccess: onCreated },
    );
  }

  return (
    <form noValidate onSubmit={onSubmit} data-testid="new-project-form" className="grid grid-cols-1 gap-4 sm:grid-cols-2">
      <div className="sm:col-span-2">
        <FormAlert problems={problems} />
      </div>
      <TextField label="Project name" name="name" required value={name} onChange={(e) => setName(e.target.value)} error={errors.name} inputRef={firstRef} autoFocus />
      <TextField label="Site" name="site" required value={site} onChange={(e) => setSite(e.target.value)} error={errors.site} />
      <TextField
        label="Client organisation"
        name="clientOrganisation"
        required
        value={clientOrganisation}
        onChange={(e) => setClientOrganisation(e.target.value)}
        error={errors.clientOrganisation}
      />
      <SelectField label="Status" name="status" value={status} onChange={(e) => setStatus(e.target.value as ProjectStatus)} error={errors.status}>
        {PROJECT_STATUSES.map((s) => (
          <option key={s} value={s}>
            {STATUS_LABELS[s]}
          </option>
        ))}
      </SelectField>
      <div className="sm:col-span-2">
        <Button type="submit" busy={create.isPending} busyLabel="Creating…">
          Create project
        </Button>
      </div>
    </form>
  );
}
