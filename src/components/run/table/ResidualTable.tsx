import { useMemo, useState } from 'react';
import type { ResidualRow } from '../../../api/types';
import { Button } from '../../Button';
import { SelectField, TextField } from '../../Field';
import { num, signed } from '../format';
import { downloadText } from './download';
import { residualCsvName, residualsToCsv } from './residualCsv';
import { compareShotIds, filterResiduals, parseLimit, sortResiduals, type ResidualSortKey, type SortDirection } from './residualFilters';

const PAGE = 100;

const COLUMNS: { key: ResidualSortKey; label: string; numeric: boolean }[] = [
  { key: 'shotId', label: 'Shot', numeric: false },
  { key: 'receiverX', label: 'Receiver x (m)', numeric: true },
  { key: 'observedMs', label: 'Observed (ms)', numeric: true },
  { key: 'computedMs', label: 'Computed (ms)', numeric: true },
  { key: 'residualMs', label: 'Residual (ms)', numeric: true },
  { key: 'sigmaMs', label: 'σ (ms)', numeric: true },
  { key: 'normalised', label: 'Residual / σ', numeric: true },
];

interface ResidualTableProps {
  rows: ResidualRow[];
  lineName: string;
  runId: string;
  initialShot: string | null;
  selectedPick: number | null;
  onSelect: (row: ResidualRow) => void;
}

/** Every pick's residual: sortable, filterable by shot, receiver range and |residual| > k·σ, and exportable as CSV. */
export function ResidualTable({ rows, lineName, runId, initialShot, selectedPick, onSelect }: ResidualTableProps) {
  const shots = useMemo(() => [...new Set(rows.map((r) => r.shotId))].sort(compareShotIds), [rows]);
  const [shot, setShot] = useState<string>(initialShot && shots.includes(initialShot) ? initialShot : '');
  const [xMinText, setXMin] = useState('');
  const [xMaxText, setXMax] = useState('');
  const [kText, setK] = useState('');
  const [includeExcluded, setIncludeExcluded] = useState(true);
  const [sort, setSort] = useState<{ key: ResidualSortKey; dir: SortDirection }>({ key: 'shotId', dir: 'asc' });
  const [page, setPage] = useState(0);

  const xMin = parseLimit(xMinText);
  const xMax = parseLimit(xMaxText);
  const reversed = xMin.value !== null && xMax.value !== null && xMax.value < xMin.value;
  const k = parseLimit(kText);
  const kOk = k.ok && (k.value === null || k.value >= 0);
  const shown = useMemo(
    () =>
      sortResiduals(
        filterResiduals(rows, { shotId: shot || null, xMin: xMin.value, xMax: xMax.value, k: kOk ? k.value : null, includeExcluded }),
        sort.key,
        sort.dir,
      ),
    [rows, shot, xMin.value, xMax.value, k.value, kOk, includeExcluded, sort],
  );
  const pages = Math.max(1, Math.ceil(shown.length / PAGE));
  const current = Math.min(page, pages - 1);
  const visible = shown.slice(current * PAGE, (current + 1) * PAGE);

  const sortBy = (key: ResidualSortKey) => {
    setSort((s) => ({ key, dir: s.key === key && s.dir === 'asc' ? 'desc' : 'asc' }));
    setPage(0);
  };
  const onFilter = <V,>(set: (v: V) => void) => (v: V) => {
    set(v);
    setPage(0);
  };

  return (
    <div data-testid="residual-table-view">
      <form className="mb-4 grid grid-cols-1 gap-4 sm:grid-cols-2 lg:grid-cols-5" onSubmit={(e) => e.preventDefault()} aria-label="Filter the residuals">
        <SelectField label="Shot" value={shot} onChange={(e) => onFilter(setShot)(e.target.value)} data-testid="filter-shot">
          <option value="">All shots</option>
          {shots.map((s) => (
            <option key={s} value={s}>
              {s}
            </option>
          ))}
        </SelectField>
        <TextField label="Receiver x from (m)" inputMode="decimal" value={xMinText} onChange={(e) => onFilter(setXMin)(e.target.value)} error={xMin.ok ? undefined : 'Type a number, or leave it empty.'} data-testid="filter-xmin" />
        <TextField label="Receiver x to (m)" inputMode="decimal" value={xMaxText} onChange={(e) => onFilter(setXMax)(e.target.value)} error={!xMax.ok ? 'Type a number, or leave it empty.' : reversed ? `“to” is less than “from” (${xMin.value} m): no receiver can be in between.` : undefined} data-testid="filter-xmax" />
        <TextField
          label="Only |residual| > k·σ, k ="
          inputMode="decimal"
          placeholder="e.g. 2"
          value={kText}
          onChange={(e) => onFilter(setK)(e.target.value)}
          error={kOk ? undefined : 'Type a number of σ, 0 or more.'}
          data-testid="filter-k"
        />
        <label className="flex items-center gap-2 self-end pb-2">
          <input type="checkbox" checked={includeExcluded} onChange={(e) => onFilter(setIncludeExcluded)(e.target.checked)} className="accent-accent-700" />
          Show excluded picks
        </label>
      </form>

      <div className="mb-2 flex flex-wrap items-center justify-between gap-3">
        <p aria-live="polite" data-testid="residual-count" className="text-stone-700">
          {shown.length === rows.length ? `All ${rows.length} picks` : `${shown.length} of ${rows.length} picks`}
          {pages > 1 && ` · page ${current + 1} of ${pages}`}
        </p>
        <Button variant="secondary" size="sm" disabled={shown.length === 0} onClick={() => downloadText(residualCsvName(lineName, runId), residualsToCsv(shown))} data-testid="download-csv">
          Download these {shown.length} rows as CSV
        </Button>
      </div>

      <div className="relative max-h-[36rem] overflow-auto rounded-lg border border-stone-200 bg-white">
        <table data-testid="residual-table" className="w-full min-w-[44rem] border-collapse text-left">
          <caption className="sr-only">Residual of every pick, observed minus computed; sort by choosing a column heading.</caption>
          <thead className="sticky top-0 z-10">
            <tr>
              {COLUMNS.map((c) => (
                <th
                  key={c.key}
                  scope="col"
                  aria-sort={sort.key === c.key ? (sort.dir === 'asc' ? 'ascending' : 'descending') : 'none'}
                  className={`border-b border-stone-300 bg-stone-100 px-3 py-2 text-sm font-semibold text-stone-700 ${c.numeric ? 'text-right' : ''}`}
                >
                  <button type="button" onClick={() => sortBy(c.key)} className="inline-flex items-center gap-1 hover:text-stone-950">
                    {c.label}
                    <span aria-hidden="true" className="text-stone-500">
                      {sort.key === c.key ? (sort.dir === 'asc' ? '▲' : '▼') : '↕'}
                    </span>
                  </button>
                </th>
              ))}
              <th scope="col" className="border-b border-stone-300 bg-stone-100 px-3 py-2 text-sm font-semibold text-stone-700">
                Notes
              </th>
            </tr>
          </thead>
          <tbody>
            {visible.map((r) => {
              const chosen = r.pickIndex === selectedPick;
              return (
                <tr key={r.pickIndex} className={`border-b border-stone-200 last:border-b-0 ${chosen ? 'bg-accent-50' : 'even:bg-stone-50'} ${r.excluded ? 'text-stone-500' : ''}`}>
                  <td className="px-3 py-1.5">
                    <button type="button" onClick={() => onSelect(r)} className="font-semibold text-accent-700 underline underline-offset-3" aria-label={`Open the pick of shot ${r.shotId} at ${r.receiverX} m`}>
                      {r.shotId}
                    </button>
                  </td>
                  <td className="px-3 py-1.5 text-right tabular-nums">{num(r.receiverX, 2)}</td>
                  <td className="px-3 py-1.5 text-right tabular-nums">{num(r.observedMs)}</td>
                  <td className="px-3 py-1.5 text-right tabular-nums">{num(r.computedMs)}</td>
                  <td className="px-3 py-1.5 text-right font-semibold tabular-nums">{signed(r.residualMs)}</td>
                  <td className="px-3 py-1.5 text-right tabular-nums">{num(r.sigmaMs)}</td>
                  <td className="px-3 py-1.5 text-right tabular-nums">{signed(r.normalised, 1)}</td>
                  <td className="px-3 py-1.5 text-sm">{r.excluded ? 'excluded' : Math.abs(r.normalised) > 3 ? 'beyond 3σ' : ''}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
        {shown.length === 0 && <p className="px-4 py-6 text-stone-600">{reversed ? 'No pick matches: the x range is reversed; swap “from” and “to”.' : 'No pick matches these filters.'}</p>}
      </div>
      {pages > 1 && (
        <div className="mt-2 flex gap-2">
          <Button variant="secondary" size="sm" disabled={current === 0} onClick={() => setPage(current - 1)}>
            Previous {PAGE}
          </Button>
          <Button variant="secondary" size="sm" disabled={current >= pages - 1} onClick={() => setPage(current + 1)}>
            Next {PAGE}
          </Button>
        </div>
      )}
    </div>
  );
}
