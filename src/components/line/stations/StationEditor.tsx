import type { ClipboardEvent, KeyboardEvent } from 'react';
import { Td, Th } from '../../Table';
import { ScrollTable } from '../ScrollTable';
import { applyPaste, COLUMN_LABELS, parsePastedCells, STATION_COLUMNS, type DraftRow, type RowErrors, type StationColumn } from './stationRows';

const cellInput =
  'w-full min-w-0 rounded border bg-white px-2 py-1 text-right tabular-nums text-stone-900 hover:border-stone-400 aria-[invalid=true]:border-red-700 aria-[invalid=true]:bg-red-50';

/**
 * The station table as inputs. Enter moves down a column, as in a spreadsheet; pasting
 * several cells (from a spreadsheet or a text file) fills the table from the cell pasted into.
 */
export function StationEditor({ rows, errors, onChange }: { rows: DraftRow[]; errors: RowErrors; onChange: (rows: DraftRow[]) => void }) {
  function edit(i: number, column: StationColumn, value: string) {
    onChange(rows.map((r, k) => (k === i ? { ...r, [column]: value } : r)));
  }

  function onPaste(e: ClipboardEvent<HTMLInputElement>, i: number, c: number) {
    const text = e.clipboardData.getData('text/plain');
    if (!/[\t\n]/.test(text)) return; // one value: let the input take it as typed
    e.preventDefault();
    onChange(applyPaste(rows, i, c, parsePastedCells(text)));
  }

  function onKeyDown(e: KeyboardEvent<HTMLInputElement>, i: number, column: StationColumn) {
    if (e.key !== 'Enter') return;
    e.preventDefault();
    const target = document.querySelector<HTMLInputElement>(`[data-cell="${i + (e.shiftKey ? -1 : 1)}-${column}"]`);
    target?.focus();
    target?.select();
  }

  return (
    <ScrollTable caption="Station table (editable)" testId="station-editor" minWidth="40rem">
      <thead>
        <tr>
          <Th numeric className="w-16">
            Row
          </Th>
          {STATION_COLUMNS.map((c) => (
            <Th key={c} numeric className={c === 'station' ? 'w-28' : 'w-36'}>
              {COLUMN_LABELS[c]}
            </Th>
          ))}
          <Th className="w-64">Check</Th>
          <Th className="w-24">
            <span className="sr-only">Actions</span>
          </Th>
        </tr>
      </thead>
      <tbody>
        {rows.map((row, i) => {
          const problems = errors.get(row.key) ?? [];
          const bad = (c: StationColumn) => problems.some((m) => m.toLowerCase().startsWith(c === 'z' ? 'elevation' : c));
          return (
            <tr key={row.key} data-testid="station-row" className={`border-b border-stone-200 last:border-b-0 [&>td]:align-middle ${problems.length ? 'bg-red-50/60' : 'even:bg-stone-50'}`}>
              <Td numeric className="text-stone-500">
                {i + 1}
              </Td>
              {STATION_COLUMNS.map((c, ci) => (
                <Td key={c} className="py-1.5">
                  <input
                    data-cell={`${i}-${c}`}
                    inputMode={c === 'station' ? 'numeric' : 'decimal'}
                    aria-label={`${COLUMN_LABELS[c]}, row ${i + 1}`}
                    aria-invalid={bad(c) || undefined}
                    aria-describedby={problems.length ? `station-row-${row.key}-errors` : undefined}
                    value={row[c]}
                    onChange={(e) => edit(i, c, e.target.value)}
                    onPaste={(e) => onPaste(e, i, ci)}
                    onKeyDown={(e) => onKeyDown(e, i, c)}
                    className={cellInput}
                  />
                </Td>
              ))}
              <Td className="py-1.5 text-sm font-semibold text-red-800">
                {problems.length > 0 && (
                  <ul id={`station-row-${row.key}-errors`} data-testid="station-row-errors">
                    {problems.map((m, k) => (
                      <li key={k}>{m}</li>
                    ))}
                  </ul>
                )}
              </Td>
              <Td className="py-1.5">
                <button
                  type="button"
                  onClick={() => onChange(rows.filter((_, k) => k !== i))}
                  aria-label={`Delete row ${i + 1}`}
                  className="rounded px-2 py-1 text-sm font-semibold text-red-800 hover:bg-red-50"
                >
                  Delete
                </button>
              </Td>
            </tr>
          );
        })}
      </tbody>
    </ScrollTable>
  );
}
