import { useId, type ReactNode } from 'react';
import { SelectField } from '../Field';

export const EXAGGERATIONS = [1, 2, 3, 5] as const;

/** Coverage threshold slider, vertical exaggeration and the contour switch, shared by the inversion and comparison pages. */
export function SectionControls({
  threshold,
  ceiling,
  onThreshold,
  exaggeration,
  onExaggeration,
  contours,
  onContours,
  children,
}: {
  threshold: number;
  ceiling: number;
  onThreshold: (m: number) => void;
  exaggeration: number;
  onExaggeration: (v: number) => void;
  contours: boolean;
  onContours: (on: boolean) => void;
  /** More controls on the same row (the colour range). */
  children?: ReactNode;
}) {
  const sliderId = useId();
  return (
    <div className="mb-4 flex flex-wrap items-end gap-x-6 gap-y-3">
      <div className="flex min-w-64 flex-col gap-1">
        <label htmlFor={sliderId} className="font-semibold text-stone-800">
          Grey out ground with less than <span className="tabular-nums" data-testid="coverage-threshold-value">{threshold.toFixed(1)}</span> m of ray
        </label>
        <input
          id={sliderId}
          type="range"
          min={0}
          max={ceiling}
          step={ceiling > 20 ? 0.5 : 0.1}
          value={Math.min(threshold, ceiling)}
          onChange={(e) => onThreshold(Number(e.target.value))}
          data-testid="coverage-threshold"
          className="accent-accent-700"
        />
      </div>
      <div className="w-48">
        <SelectField label="Vertical exaggeration" value={String(exaggeration)} onChange={(e) => onExaggeration(Number(e.target.value))} data-testid="inversion-exaggeration">
          {EXAGGERATIONS.map((v) => (
            <option key={v} value={v}>
              {v === 1 ? '1× (true scale)' : `${v}×`}
            </option>
          ))}
        </SelectField>
      </div>
      <label className="flex items-center gap-2 pb-2">
        <input type="checkbox" checked={contours} onChange={(e) => onContours(e.target.checked)} className="accent-accent-700" data-testid="show-contours" />
        Iso-velocity contours
      </label>
      {children}
    </div>
  );
}
