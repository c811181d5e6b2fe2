import type { ReactNode } from 'react';
import type { DisplaySettings } from './displaySettings';

const input = 'w-24 rounded-md border border-stone-300 bg-white px-2 py-1 tabular-nums hover:border-stone-400';

/** Optional positive number from a text box: empty (or 0) means off. */
const optional = (text: string): number | null => {
  const v = Number(text);
  return text.trim() === '' || !Number.isFinite(v) || v <= 0 ? null : v;
};

function Control({ label, children, hint }: { label: string; children: ReactNode; hint?: string }) {
  return (
    <label className="flex flex-col gap-1 text-sm font-semibold text-stone-700" title={hint}>
      {label}
      {children}
    </label>
  );
}

/** Display and processing of the traces: what is drawn, gains, the band-pass filter and the reduced-time velocity. */
export function DisplayControls({ value, onChange, nyquistHz }: { value: DisplaySettings; onChange: (next: DisplaySettings) => void; nyquistHz: number }) {
  const set = (patch: Partial<DisplaySettings>) => onChange({ ...value, ...patch });
  const bandProblem =
    value.lowHz !== null && value.highHz !== null && value.lowHz >= value.highHz
      ? 'The low cut must be below the high cut.'
      : (value.highHz ?? 0) >= nyquistHz || (value.lowHz ?? 0) >= nyquistHz
        ? `Corners must be below ${Math.round(nyquistHz)} Hz (half the sampling rate); that side is off.`
        : null;
  return (
    <fieldset data-testid="display-controls" className="flex flex-wrap items-end gap-x-4 gap-y-3 rounded-lg border border-stone-200 bg-white px-4 py-3">
      <legend className="sr-only">Display</legend>
      <Control label="Show">
        <select className={input.replace('w-24', 'w-32')} value={value.mode} onChange={(e) => set({ mode: e.target.value as DisplaySettings['mode'] })} data-testid="display-mode">
          <option value="wiggle">Wiggles</option>
          <option value="density">Density</option>
          <option value="both">Both</option>
        </select>
      </Control>
      <Control label="Scale">
        <select className={input.replace('w-24', 'w-36')} value={value.normalise} onChange={(e) => set({ normalise: e.target.value as DisplaySettings['normalise'] })}>
          <option value="trace">Each trace</option>
          <option value="record">Whole record</option>
        </select>
      </Control>
      <Control label="Gain">
        <input className={input} type="number" min={0.1} max={20} step={0.1} value={value.gain} onChange={(e) => Number(e.target.value) > 0 && set({ gain: Number(e.target.value) })} data-testid="display-gain" />
      </Control>
      <Control label="Clip (traces)" hint="Largest swing of a wiggle, in trace spacings; empty: no clip">
        <input className={input} type="number" min={0} step={0.25} value={value.clip ?? ''} onChange={(e) => set({ clip: optional(e.target.value) })} />
      </Control>
      <Control label="AGC window (ms)" hint="Automatic gain control: each sample over the RMS in this window; empty or 0: off">
        <input className={input} type="number" min={0} step={5} value={value.agcMs || ''} onChange={(e) => set({ agcMs: optional(e.target.value) ?? 0 })} data-testid="display-agc" />
      </Control>
      <Control label="Low cut (Hz)" hint="Butterworth band-pass, run forward and back (no time shift)">
        <input className={input} type="number" min={0} step={5} value={value.lowHz ?? ''} onChange={(e) => set({ lowHz: optional(e.target.value) })} data-testid="display-lowcut" />
      </Control>
      <Control label="High cut (Hz)">
        <input className={input} type="number" min={0} step={10} value={value.highHz ?? ''} onChange={(e) => set({ highHz: optional(e.target.value) })} data-testid="display-highcut" />
      </Control>
      <Control label="Reduce at (m/s)" hint="Reduced time: time − offset / velocity; arrivals at this velocity line up flat">
        <input className={input} type="number" min={0} step={100} value={value.reduceVelocity ?? ''} onChange={(e) => set({ reduceVelocity: optional(e.target.value) })} data-testid="display-reduce" />
      </Control>
      <label className="flex items-center gap-2 self-center text-sm font-semibold text-stone-700">
        <input type="checkbox" checked={value.snapClicks} onChange={(e) => set({ snapClicks: e.target.checked })} data-testid="display-snap" />
        Snap clicks to the onset
      </label>
      {bandProblem && (
        <p role="status" className="w-full text-sm font-semibold text-amber-800">
          {bandProblem}
        </p>
      )}
    </fieldset>
  );
}
