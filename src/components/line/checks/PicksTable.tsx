import { useState } from 'react';
import type { PickFlag } from '../../../../shared/qc';
import type { PickRow, PickSetShot } from '../../../api/types';
import { Button } from '../../Button';
import { SelectField } from '../../Field';
import { Td, Th } from '../../Table';
import { ScrollTable } from '../ScrollTable';
import { showMetres, showMs } from './numbers';
import { SUSPECT_LABELS } from './qcPicks';

const PAGE = 100;

/**
 * Every pick of the revision, filtered by shot and paged (a pick set can hold 200 000 picks).
 * With `onToggle` the rows carry checkboxes, for choosing picks to exclude or include again.
 */
export function PicksTable({
  picks,
  shots,
  flags,
  exclusions,
  saved,
  selected,
  onToggle,
}: {
  picks: readonly PickRow[];
  shots: PickSetShot[];
  flags: readonly PickFlag[];
  /** The exclusions as they stand (saved plus unsaved edits): pick index → reason. */
  exclusions: ReadonlyMap<number, string>;
  saved: ReadonlyMap<number, string>;
  selected: ReadonlySet<number>;
  onToggle?: (indices: number[], on: boolean) => void;
}) {
  const [shot, setShot] = useState('');
  const [onlyMarked, setOnlyMarked] = useState(false);
  const [page, setPage] = useState(0);
  const flagOf = new Map(flags.map((f) => [f.index, f]));

  const rows = picks.filter((p) => (!shot || p.shotId === shot) && (!onlyMarked || flagOf.has(p.index) || exclusions.has(p.index) || selected.has(p.index)));
  const pages = Math.max(1, Math.ceil(rows.length / PAGE));
  const current = Math.min(page, pages - 1);
  const shown = rows.slice(current * PAGE, current * PAGE + PAGE);
  const allShownSelected = shown.length > 0 && shown.every((p) => selected.has(p.index));

  return (
    <div data-testid="picks-panel">
      <div className="mb-3 flex flex-wrap items-end gap-4">
        <div className="w-48">
          <SelectField
            label="Shot"
            value={shot}
            onChange={(e) => {
              setShot(e.target.value);
              setPage(0);
            }}
            data-testid="picks-shot-filter"
          >
            <option value="">All shots</option>
            {shots.map((s) => (
              <option key={s.shotId} value={s.shotId}>
                {s.shotId}
              </option>
            ))}
          </SelectField>
        </div>
        <label className="flex items-center gap-2 pb-2">
          <input
            type="checkbox"
            checked={onlyMarked}
            onChange={(e) => {
              setOnlyMarked(e.target.checked);
              setPage(0);
            }}
            className="size-4 accent-accent-700"
          />
          Only suspect, excluded or selected picks
        </label>
        <p className="pb-2 text-sm text-stone-600">
          {rows.length.toLocaleString('en-GB')} picks{pages > 1 ? `, page ${current + 1} of ${pages}` : ''}
        </p>
      </div>
      <ScrollTable caption="Picks" testId="picks-table" minWidth="46rem">
        <thead>
          <tr>
            {onToggle && (
              <Th className="w-12">
                <input
                  type="checkbox"
                  checked={allShownSelected}
                  onChange={(e) => onToggle(shown.map((p) => p.index), e.target.checked)}
                  aria-label="Select every pick on this page"
                  className="size-4 accent-accent-700"
                />
              </Th>
            )}
            <Th numeric>File line</Th>
            <Th>Shot</Th>
            <Th numeric>Receiver x (m)</Th>
            <Th numeric>Receiver z (m)</Th>
            <Th numeric>Time (ms)</Th>
            <Th numeric>σ (ms)</Th>
            <Th>Status</Th>
          </tr>
        </thead>
        <tbody>
          {shown.map((p) => {
            const reason = exclusions.get(p.index);
            const changed = reason !== saved.get(p.index);
            const flag = flagOf.get(p.index);
            return (
              <tr
                key={p.index}
                data-testid="pick-row"
                data-index={p.index}
                className={`border-b border-stone-200 last:border-b-0 [&>td]:align-middle ${selected.has(p.index) ? 'bg-accent-50' : reason !== undefined ? 'bg-stone-100 text-stone-500' : 'even:bg-stone-50'}`}
              >
                {onToggle && (
                  <Td className="py-1.5">
                    <input
                      type="checkbox"
                      checked={selected.has(p.index)}
                      onChange={(e) => onToggle([p.index], e.target.checked)}
                      aria-label={`Select the pick on file line ${p.line} (shot ${p.shotId}, x ${p.receiverX} m)`}
                      className="size-4 accent-accent-700"
                    />
                  </Td>
                )}
                <Td numeric className="text-stone-600">
                  {p.line}
                </Td>
                <Td>{p.shotId}</Td>
                <Td numeric>{showMetres(p.receiverX)}</Td>
                <Td numeric>{p.receiverZ === null ? <span className="text-stone-400">surface</span> : showMetres(p.receiverZ)}</Td>
                <Td numeric className={reason !== undefined ? 'line-through' : ''}>
                  {showMs(p.timeMs)}
                </Td>
                <Td numeric>{showMs(p.sigmaMs)}</Td>
                <Td className="text-sm">
                  {reason !== undefined && (
                    <span className="block">
                      Excluded: {reason}
                      {changed && <em className="ml-1 text-accent-800">(not saved yet)</em>}
                    </span>
                  )}
                  {reason === undefined && changed && <em className="block text-accent-800">Included again (not saved yet)</em>}
                  {flag && <span className="block font-semibold text-red-900">{SUSPECT_LABELS[flag.kind]}</span>}
                </Td>
              </tr>
            );
          })}
        </tbody>
      </ScrollTable>
      {pages > 1 && (
        <nav aria-label="Pick table pages" className="mt-3 flex items-center gap-3">
          <Button variant="secondary" size="sm" disabled={current === 0} onClick={() => setPage(current - 1)}>
            Previous
          </Button>
          <span className="text-sm text-stone-600">
            Page {current + 1} of {pages}
          </span>
          <Button variant="secondary" size="sm" disabled={current >= pages - 1} onClick={() => setPage(current + 1)}>
            Next
          </Button>
        </nav>
      )}
    </div>
  );
}
