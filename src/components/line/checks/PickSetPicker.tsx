import { pickSetFileUrl } from '../../../api/picksets';
import type { PickSetDetail, PickSetSummary } from '../../../api/types';
import { formatDate } from '../../../lib/format';
import { SelectField } from '../../Field';

/** Which pick set, and which of its revisions, the checks below are for. */
export function PickSetPicker({
  pickSets,
  pickSetId,
  detail,
  revision,
  onChange,
  failed = false,
}: {
  pickSets: PickSetSummary[];
  pickSetId: string;
  detail: PickSetDetail | undefined;
  revision: number | null;
  onChange: (pickSetId: string, revision: number | null) => void;
  /** The pick set could not be loaded: say so in the revision list instead of "Loading…". */
  failed?: boolean;
}) {
  const revisions = detail && detail.id === pickSetId ? [...detail.revisions].reverse() : [];
  const latest = revisions[0]?.number;
  const shown = revision ?? latest;
  return (
    <div className="mb-6 flex flex-wrap items-end gap-4 rounded-lg border border-stone-200 bg-white px-5 py-4">
      <div className="min-w-64 flex-1">
        <SelectField label="Pick set" value={pickSetId} onChange={(e) => onChange(e.target.value, null)} data-testid="checks-pickset">
          {pickSets.map((p) => (
            <option key={p.id} value={p.id}>
              {p.fileName} · {formatDate(p.createdAt)} · {p.picks.toLocaleString('en-GB')} picks
            </option>
          ))}
        </SelectField>
      </div>
      <div className="min-w-64 flex-1">
        <SelectField
          label="Revision"
          value={shown === undefined ? '' : String(shown)}
          disabled={revisions.length === 0}
          onChange={(e) => onChange(pickSetId, Number(e.target.value) === latest ? null : Number(e.target.value))}
          data-testid="checks-revision"
        >
          {revisions.length === 0 && <option value="">{failed ? '—' : 'Loading…'}</option>}
          {revisions.map((r) => (
            <option key={r.number} value={r.number}>
              {r.number === 0 ? 'Revision 0, as uploaded' : `Revision ${r.number}`}
              {r.number === latest && r.number !== 0 ? ' (latest)' : ''} · {r.excluded} excluded
              {r.createdBy ? ` · ${r.createdBy.name}` : ''} · {formatDate(r.createdAt)}
              {r.comment && r.number !== 0 ? ` · “${r.comment}”` : ''}
            </option>
          ))}
        </SelectField>
      </div>
      <a href={pickSetFileUrl(pickSetId)} className="pb-2 font-semibold">
        Download the original file
      </a>
    </div>
  );
}
