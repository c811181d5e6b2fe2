import { useState, type FormEvent } from 'react';
import { useSaveBorehole } from '../../api/boreholes';
import { ApiError, issueField } from '../../api/errors';
import { formProblems } from '../../lib/formErrors';
import type { BoreholeBody, BoreholeView } from '../../../shared/schemas/boreholes';
import { Button } from '../Button';
import { SelectField, TextField } from '../Field';
import { FormAlert } from '../FormAlert';

interface ContactRow {
  depth: string;
  material: string;
  rockTop: boolean;
}

/** "contacts[2].depth" → "Contact 3". */
const contactLabel = (path: string | (string | number)[]): string => {
  const index = Array.isArray(path) ? Number(path[1]) : Number(/\[(\d+)\]/.exec(path)?.[1]);
  return Number.isInteger(index) ? `Contact ${index + 1}` : 'Contacts';
};

const num = (text: string): number | null => (text.trim() === '' ? null : Number(text.replace(',', '.')));

/** Add or edit one hole: where it is, its ground and water level, and the contacts logged top-down. */
export function BoreholeForm({ lineId, hole, onDone }: { lineId: string; hole: BoreholeView | null; onDone: () => void }) {
  const save = useSaveBorehole(lineId);
  const [name, setName] = useState(hole?.name ?? '');
  const [kind, setKind] = useState<BoreholeBody['kind']>(hole?.kind ?? 'borehole');
  const [x, setX] = useState(hole ? String(hole.x) : '');
  const [groundZ, setGroundZ] = useState(hole?.groundZ === null || !hole ? '' : String(hole.groundZ));
  const [water, setWater] = useState(hole?.waterDepth === null || !hole ? '' : String(hole.waterDepth));
  const [note, setNote] = useState(hole?.note ?? '');
  const [contacts, setContacts] = useState<ContactRow[]>(
    hole?.contacts.map((c) => ({ depth: String(c.depth), material: c.material, rockTop: c.rockTop })) ?? [{ depth: '0', material: '', rockTop: false }],
  );
  const setContact = (i: number, patch: Partial<ContactRow>) => setContacts((all) => all.map((c, j) => (j === i ? { ...c, ...patch } : c)));

  function submit(e: FormEvent) {
    e.preventDefault();
    // The server checks everything (the same schema as a file); numbers that do not parse go as NaN and come back as a message.
    const body = {
      name,
      kind,
      x: num(x) ?? Number.NaN,
      groundZ: num(groundZ),
      waterDepth: num(water),
      note,
      contacts: contacts.map((c) => ({ depth: num(c.depth) ?? Number.NaN, material: c.material, rockTop: c.rockTop })),
    } as BoreholeBody;
    save.mutate({ id: hole?.id ?? null, body }, { onSuccess: onDone });
  }

  const problems = formProblems(save.error, ['name', 'kind', 'x', 'groundZ', 'waterDepth', 'note']);
  const contactProblems = (save.error instanceof ApiError ? save.error.issues : []).filter((i) => issueField(i) === 'contacts');
  return (
    <form onSubmit={submit} noValidate data-testid="borehole-form" className="flex flex-col gap-3 rounded-lg border border-stone-200 bg-white p-4">
      <h3 className="font-semibold text-stone-900">{hole ? `Edit ${hole.name}` : 'Add a borehole or trial pit'}</h3>
      <FormAlert problems={{ ...problems, other: problems.other.filter((o) => !o.startsWith('contacts')) }} />
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <TextField label="Name" value={name} onChange={(e) => setName(e.target.value)} error={problems.fields.name} data-testid="borehole-name" />
        <SelectField label="Kind" value={kind} onChange={(e) => setKind(e.target.value as BoreholeBody['kind'])}>
          <option value="borehole">Borehole</option>
          <option value="trial_pit">Trial pit</option>
        </SelectField>
        <TextField label="Position x (m)" inputMode="decimal" value={x} onChange={(e) => setX(e.target.value)} error={problems.fields.x} data-testid="borehole-x" />
        <TextField label="Ground elevation (m)" inputMode="decimal" value={groundZ} onChange={(e) => setGroundZ(e.target.value)} error={problems.fields.groundZ} hint="Empty: taken from the stations." />
        <TextField label="Water depth (m below ground)" inputMode="decimal" value={water} onChange={(e) => setWater(e.target.value)} error={problems.fields.waterDepth} hint="Empty: none logged." />
        <TextField label="Note" value={note} onChange={(e) => setNote(e.target.value)} error={problems.fields.note} />
      </div>
      <fieldset>
        <legend className="font-semibold text-stone-800">Logged contacts, top-down (depth where each material begins)</legend>
        <ul className="mt-2 flex flex-col gap-2" data-testid="borehole-contacts">
          {contacts.map((c, i) => (
            <li key={i} className="flex flex-wrap items-center gap-2">
              <input aria-label={`Depth of contact ${i + 1} (m)`} inputMode="decimal" className="w-24 rounded-md border border-stone-300 px-2 py-1 tabular-nums" value={c.depth} onChange={(e) => setContact(i, { depth: e.target.value })} />
              <input aria-label={`Material of contact ${i + 1}`} className="min-w-0 flex-1 rounded-md border border-stone-300 px-2 py-1" value={c.material} placeholder="e.g. weathered sandstone" onChange={(e) => setContact(i, { material: e.target.value })} />
              <label className="flex items-center gap-1 text-sm">
                <input type="checkbox" checked={c.rockTop} onChange={(e) => setContact(i, { rockTop: e.target.checked })} />
                top of rock
              </label>
              <Button size="sm" variant="quiet" onClick={() => setContacts((all) => all.filter((_, j) => j !== i))} aria-label={`Remove contact ${i + 1}`} disabled={contacts.length === 1}>
                Remove
              </Button>
            </li>
          ))}
        </ul>
        <Button className="mt-2" size="sm" variant="secondary" onClick={() => setContacts((all) => [...all, { depth: '', material: '', rockTop: false }])} data-testid="borehole-add-contact">
          Add a contact
        </Button>
        {contactProblems.length > 0 && (
          <ul role="alert" className="mt-2 list-disc pl-5 text-sm font-semibold text-red-800">
            {contactProblems.map((p, k) => (
              <li key={k}>
                {contactLabel(p.path)}: {p.message}
              </li>
            ))}
          </ul>
        )}
      </fieldset>
      <div className="flex gap-2">
        <Button type="submit" busy={save.isPending} busyLabel="Saving…" data-testid="borehole-save">
          {hole ? 'Save changes' : 'Add the hole'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
