import { useId } from 'react';
import type { ColourSource, SectionColours } from './useSectionColours';

const metres = (v: number) => `${Math.round(v)}`;

/**
 * Which velocity range a section's colours span: the project's (the same colour means the same
 * velocity everywhere), this section's own values, or a range set here for this view.
 */
export function SectionColoursControl({ colours, testId = 'section-colours' }: { colours: SectionColours; testId?: string }) {
  const id = useId();
  const { source, setSource, custom, setCustom, customProblem, projectRange, sectionRange } = colours;
  return (
    <div className="flex flex-wrap items-end gap-x-3 gap-y-2" data-testid={testId}>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-source`} className="font-semibold text-stone-800">
          Velocity colours
        </label>
        <select
          id={`${id}-source`}
          value={source}
          onChange={(e) => setSource(e.target.value as ColourSource)}
          className="max-w-full rounded-md border border-stone-300 bg-white px-2 py-1.5"
          data-testid={`${testId}-source`}
        >
          <option value="project">
            Project scale, {metres(projectRange.min)}–{metres(projectRange.max)} m/s
          </option>
          {sectionRange && (
            <option value="section">
              This section only, {metres(sectionRange.min)}–{metres(sectionRange.max)} m/s
            </option>
          )}
          <option value="custom">Set a range for this view</option>
        </select>
      </div>
      {source === 'custom' && (
        <fieldset className="flex flex-col gap-1">
          <legend className="sr-only">Colour range for this view</legend>
          <span className="flex items-center gap-2">
            <RangeEnd label="Slow end (m/s)" value={custom.min} onChange={(min) => setCustom({ ...custom, min })} testId={`${testId}-min`} />
            <span aria-hidden="true">to</span>
            <RangeEnd label="Fast end (m/s)" value={custom.max} onChange={(max) => setCustom({ ...custom, max })} testId={`${testId}-max`} />
            <span className="text-sm text-stone-600">m/s</span>
          </span>
          {customProblem && (
            <span role="alert" className="text-sm font-semibold text-red-800" data-testid={`${testId}-problem`}>
              {customProblem} The project scale is shown meanwhile.
            </span>
          )}
        </fieldset>
      )}
    </div>
  );
}

function RangeEnd({ label, value, onChange, testId }: { label: string; value: number; onChange: (v: number) => void; testId: string }) {
  return (
    <input
      type="number"
      aria-label={label}
      step={50}
      value={Number.isFinite(value) ? value : ''}
      onChange={(e) => onChange(e.target.value === '' ? Number.NaN : Number(e.target.value))}
      className="w-24 rounded-md border border-stone-300 px-2 py-1.5 tabular-nums"
      data-testid={testId}
    />
  );
}
