/**
 * The grid in a person's terms (x from, x to, top, depth, spacing dx = dz). Nothing changes until
 * "Apply"; a grid over the documented size limit is refused with its size, by the same rule the
 * API runs, before anything is allocated.
 */
import { useEffect, useState, type FormEvent } from 'react';
import type { Grid } from '../../../shared/grid';
import { MAX_GRID_NODES } from '../../../shared/limits';
import { checkModelRules } from '../../../shared/model';
import { checkGridSpec, gridFromSpec, specFromGrid, type GridSpec } from '../../../shared/model/edit';
import { Button } from '../Button';

const FIELDS: { key: keyof GridSpec; label: string }[] = [
  { key: 'xStart', label: 'x from (m)' },
  { key: 'xEnd', label: 'x to (m)' },
  { key: 'top', label: 'Top elevation (m)' },
  { key: 'depth', label: 'Depth (m)' },
  { key: 'spacing', label: 'Spacing dx = dz (m)' },
];

const fmt = (n: number): string => n.toLocaleString('en-US');

export function GridForm({ grid, readOnly, lockedReason, onApply }: { grid: Grid; readOnly: boolean; lockedReason?: string; onApply: (g: Grid) => string | null }) {
  const [text, setText] = useState<Record<keyof GridSpec, string>>(() => asText(specFromGrid(grid)));
  const [message, setMessage] = useState<string | null>(null);
  useEffect(() => setText(asText(specFromGrid(grid))), [grid]);

  const spec = Object.fromEntries(Object.entries(text).map(([k, v]) => [k, v.trim() === '' ? Number.NaN : Number(v)])) as unknown as GridSpec;
  const fieldErrors = checkGridSpec(spec);
  const hasFieldErrors = Object.keys(fieldErrors).length > 0;
  const next = hasFieldErrors ? null : gridFromSpec(spec);
  const sizeIssue = next ? checkModelRules({ grid: next, layers: [{}] }).find((i) => i.path[0] === 'grid') : undefined;
  const disabled = readOnly || Boolean(lockedReason);

  function submit(e: FormEvent) {
    e.preventDefault();
    if (!next || sizeIssue) {
      setMessage(sizeIssue ? `Refused: the ${sizeIssue.message}.` : 'Correct the marked fields first.');
      return;
    }
    setMessage(onApply(next));
  }

  return (
    <form onSubmit={submit} noValidate data-testid="grid-form" className="space-y-3">
      <div className="grid grid-cols-2 gap-3">
        {FIELDS.map(({ key, label }) => (
          <label key={key} className="flex flex-col gap-1 text-sm font-semibold text-stone-800">
            {label}
            <input
              type="text"
              inputMode="decimal"
              name={key}
              value={text[key]}
              disabled={disabled}
              aria-invalid={fieldErrors[key] ? true : undefined}
              onChange={(e) => {
                setText({ ...text, [key]: e.target.value });
                setMessage(null);
              }}
              className={`rounded-md border bg-white px-2 py-1 text-right font-normal tabular-nums text-stone-900 disabled:bg-stone-100 ${fieldErrors[key] ? 'border-red-700' : 'border-stone-300'}`}
            />
            {fieldErrors[key] && <span className="font-semibold text-red-800">{fieldErrors[key]}</span>}
          </label>
        ))}
      </div>
      <p data-testid="grid-size" className={`text-sm tabular-nums ${sizeIssue ? 'font-semibold text-red-800' : 'text-stone-700'}`}>
        {next ? `${fmt(next.nx)} × ${fmt(next.nz)} = ${fmt(next.nx * next.nz)} nodes` : 'Enter the grid numbers.'}
        {sizeIssue && ` — over the limit of ${fmt(MAX_GRID_NODES)}`}
      </p>
      {lockedReason && <p className="text-sm text-stone-600">{lockedReason}</p>}
      {message && (
        <p role="alert" data-testid="grid-message" className="rounded-md border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-950">
          {message}
        </p>
      )}
      {!disabled && (
        <Button type="submit" variant="secondary" size="sm">
          Apply grid
        </Button>
      )}
    </form>
  );
}

const asText = (s: GridSpec): Record<keyof GridSpec, string> => ({
  xStart: String(s.xStart), xEnd: String(s.xEnd), top: String(s.top), depth: String(s.depth), spacing: String(s.spacing),
});
