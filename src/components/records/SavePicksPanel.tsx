import { useState } from 'react';
import { Link } from 'react-router';
import { useQueryClient } from '@tanstack/react-query';
import { errorMessage } from '../../api/errors';
import { recordDetailQuery, useSavePicksFromRecords } from '../../api/records';
import type { PickSetCreated, PickSetSummary } from '../../api/types';
import type { RecordSummaryView } from '../../../shared/schemas/records';
import { Button } from '../Button';
import { SelectField, TextField } from '../Field';
import type { PickingState } from './pickingState';
import { pickRows } from './pickRows';

/**
 * Save every record's picks as one pick set of the line, linked to the records it came from: a new
 * set, or the next version of one in use (which is then retired, kept for the runs that used it).
 */
export function SavePicksPanel({ lineId, records, pickSets, picking, onSaved }: { lineId: string; records: RecordSummaryView[]; pickSets: PickSetSummary[]; picking: PickingState; onSaved: () => void }) {
  const queryClient = useQueryClient();
  const save = useSavePicksFromRecords(lineId);
  const [name, setName] = useState(() => `Picks from records ${new Date().toISOString().slice(0, 10)}`);
  const [problems, setProblems] = useState<string[]>([]);
  const [saved, setSaved] = useState<PickSetCreated | null>(null);
  /** '' for a new pick set, else the id of the set these picks replace. */
  const [replaces, setReplaces] = useState('');
  const replaced = pickSets.find((p) => p.id === replaces) ?? null;
  const [preparing, setPreparing] = useState(false);
  const withPicks = records.filter((r) => picking.byRecord[r.id]?.some((m) => m !== null));

  async function submit() {
    setProblems([]);
    setSaved(null);
    if (!name.trim()) return setProblems(['Give the pick set a name.']);
    setPreparing(true);
    try {
      const picked = await Promise.all(
        withPicks.map(async (summary) => ({ summary, traces: (await queryClient.fetchQuery(recordDetailQuery(summary.id))).traces, marks: picking.byRecord[summary.id]! })),
      );
      const result = pickRows(picked);
      const found = [...result.problems];
      if (result.unplaced > 0) found.push(`${result.unplaced} picks are on traces with no receiver position (neither in the file nor a station with the channel's number); add the stations, or they are left out.`);
      if (result.problems.length || !result.rows.length) {
        setProblems(result.rows.length ? found : [...found, 'There are no picks to save yet.']);
        return;
      }
      save.mutate(
        { name: name.trim(), recordIds: result.recordIds, picks: result.rows, ...(replaced ? { replaces: replaced.id } : {}) },
        {
          onSuccess: (created) => {
            setSaved(created);
            setReplaces('');
            setProblems(result.unplaced > 0 ? found : []);
            onSaved();
          },
        },
      );
    } catch (err) {
      setProblems([errorMessage(err)]);
    } finally {
      setPreparing(false);
    }
  }

  return (
    <section aria-labelledby="save-picks-title" data-testid="save-picks" className="rounded-lg border border-stone-200 bg-white p-4">
      <h2 id="save-picks-title" className="font-semibold text-stone-900">
        Save as a pick set
      </h2>
      <p className="mt-1 text-sm text-stone-600">
        {withPicks.length} of {records.length} records picked · {picking.unsaved > 0 ? `${picking.unsaved} changes not saved` : 'nothing unsaved'}
      </p>
      <div className="mt-3 flex flex-col gap-3">
        <SelectField label="Save as" value={replaces} onChange={(e) => setReplaces(e.target.value)} data-testid="save-picks-as">
          <option value="">A new pick set</option>
          {pickSets.map((p) => (
            <option key={p.id} value={p.id}>
              A new version of {p.fileName}
            </option>
          ))}
        </SelectField>
        {replaced && (
          <p data-testid="save-picks-replaces" className="text-sm text-stone-700">
            {replaced.fileName} will be retired: hidden from new runs, inversions and checks, kept for the ones that used it. Reinstate it on the Pick sets tab if needed.
          </p>
        )}
        <TextField label="Name" value={name} onChange={(e) => setName(e.target.value)} data-testid="save-picks-name" />
      </div>
      <Button className="mt-3" onClick={() => void submit()} busy={preparing || save.isPending} busyLabel="Saving…" disabled={!withPicks.length} data-testid="save-picks-button">
        Save picks
      </Button>
      {(problems.length > 0 || save.error) && (
        <ul role="alert" data-testid="save-picks-problems" className="mt-3 list-disc pl-5 text-sm text-red-800">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
          {save.error && <li>{errorMessage(save.error)}</li>}
        </ul>
      )}
      {saved && (
        <p role="status" data-testid="save-picks-done" className="mt-3 text-sm text-accent-900">
          Saved: {saved.picks} picks of {saved.shots} shots.{' '}
          <Link to={`/lines/${lineId}?tab=checks&pickset=${saved.id}`} className="font-semibold">
            Check the new pick set
          </Link>
        </p>
      )}
    </section>
  );
}
