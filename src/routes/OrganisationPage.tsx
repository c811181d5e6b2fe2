import { useEffect, useState, type FormEvent } from 'react';
import { organisationLogoUrl, useOrganisation, useSaveOrganisation, useUploadLogo } from '../api/organisation';
import { Button } from '../components/Button';
import { TextAreaField, TextField } from '../components/Field';
import { FormAlert } from '../components/FormAlert';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { Panel } from '../components/Panel';
import { useSignedInUser } from '../components/meContext';
import type { Organisation } from '../api/types';
import { formProblems } from '../lib/formErrors';
import { isAdmin } from '../lib/permissions';
import { NotFoundPage } from './NotFoundPage';

/** The API's limit (shared/schemas/organisation.ts), checked here first to save a pointless upload. */
const MAX_LOGO_KB = 512;

export function OrganisationPage() {
  const me = useSignedInUser();
  if (!isAdmin(me)) return <NotFoundPage />;
  return <OrganisationContent />;
}

function OrganisationContent() {
  const org = useOrganisation();
  return (
    <>
      <title>Organisation · Timefield</title>
      <PageHeader title="Organisation">
        The consultancy named on the cover and in the page headers of every report. Reports already submitted keep the name and address they
        were submitted with.
      </PageHeader>
      {org.isPending && <Loading what="organisation" />}
      {org.isError && <LoadError error={org.error} what="organisation" onRetry={() => void org.refetch()} />}
      {org.data && (
        <div className="grid grid-cols-1 items-start gap-6 lg:grid-cols-2">
          <Panel title="Name and address">
            <DetailsForm org={org.data} />
          </Panel>
          <Panel title="Logo">
            <LogoForm org={org.data} />
          </Panel>
        </div>
      )}
    </>
  );
}

function DetailsForm({ org }: { org: Organisation }) {
  const save = useSaveOrganisation();
  const [name, setName] = useState(org.name);
  const [address, setAddress] = useState(org.address);
  const [missing, setMissing] = useState(false);
  const problems = formProblems(save.error, ['name', 'address']);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    setMissing(!name.trim());
    if (!name.trim()) return;
    save.mutate({ name: name.trim(), address: address.trim() });
  }

  return (
    <form noValidate onSubmit={onSubmit} data-testid="organisation-form" className="grid gap-4">
      <FormAlert problems={problems} />
      <TextField label="Consultancy name" value={name} onChange={(e) => setName(e.target.value)} maxLength={200} error={missing ? 'Enter the name printed on reports.' : problems.fields.name} />
      <TextAreaField label="Postal address" hint="Printed under the name on the report cover." rows={3} value={address} onChange={(e) => setAddress(e.target.value)} maxLength={1000} error={problems.fields.address} />
      <div className="flex items-center gap-4">
        <Button type="submit" busy={save.isPending} busyLabel="Saving…" data-testid="organisation-save">
          Save
        </Button>
        {save.isSuccess && !save.isPending && (
          <p role="status" data-testid="organisation-saved" className="text-stone-700">
            Saved. New reports use it from now on.
          </p>
        )}
      </div>
    </form>
  );
}

function LogoForm({ org }: { org: Organisation }) {
  const upload = useUploadLogo();
  const [file, setFile] = useState<File | null>(null);
  const [check, setCheck] = useState<string | null>(null);
  const problems = formProblems(upload.error, ['file']);
  useEffect(() => setCheck(null), [file]);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    if (!file) return setCheck('Choose a PNG or JPEG file first.');
    if (file.size > MAX_LOGO_KB * 1024) return setCheck(`The logo is larger than ${MAX_LOGO_KB} KB; save a smaller image.`);
    upload.mutate(file);
  }

  return (
    <form noValidate onSubmit={onSubmit} data-testid="logo-form" className="grid gap-4">
      {org.hasLogo ? (
        <img src={organisationLogoUrl(org.updatedAt)} alt="The current logo" data-testid="logo-preview" className="max-h-20 max-w-60 object-contain" />
      ) : (
        <p className="text-stone-600">No logo yet: reports show the name alone.</p>
      )}
      {!org.name && <p className="text-stone-700">Save the consultancy name first.</p>}
      <FormAlert problems={problems} />
      <label className="grid gap-1">
        <span className="font-semibold text-stone-900">Logo file</span>
        <span id="logo-hint" className="text-sm text-stone-600">
          PNG or JPEG, at most {MAX_LOGO_KB} KB. It is printed about 4 cm wide at the top right of the cover.
        </span>
        <input type="file" accept="image/png,image/jpeg" aria-describedby="logo-hint" aria-invalid={check || problems.fields.file ? true : undefined} data-testid="logo-file" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
        {(check || problems.fields.file) && <span className="text-sm text-red-800">{check ?? problems.fields.file}</span>}
      </label>
      <div>
        <Button type="submit" variant="secondary" busy={upload.isPending} busyLabel="Uploading…" disabled={!org.name} data-testid="logo-upload">
          Upload logo
        </Button>
      </div>
    </form>
  );
}
