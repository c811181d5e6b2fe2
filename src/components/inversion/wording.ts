import type { InversionSettings } from '../../../shared/inversion/types';
import type { InversionView } from '../../../shared/schemas/inversions';

/** Wording for inversion states, stop reasons and settings, shared by every inversion view. */

export const INVERSION_STATUS_LABELS: Record<InversionView['status'], string> = {
  queued: 'Waiting to start',
  running: 'Inverting',
  done: 'Finished',
  failed: 'Failed',
  cancelled: 'Cancelled',
};

type StopReason = NonNullable<InversionView['stats']>['stopReason'];

export const STOP_REASON_WORDS: Record<StopReason, string> = {
  'target-misfit': 'reached the target fit (χ² per datum between 0.9 and 1.1)',
  stalled: 'stopped improving (χ² changed by less than 2 % in an iteration)',
  'iteration-cap': 'reached the iteration cap before the target fit',
  cancelled: 'was cancelled',
};

/** "Automatic 1-D gradient (0.5 m cells; v0 420 m/s, k 31 /s)" or "Model version 3". */
export function startWords(start: InversionView['start']): string {
  if (start.kind === 'gradient') {
    const fit = start.v0 !== null && start.k !== null ? `; fitted v₀ ${Math.round(start.v0)} m/s, k ${start.k.toFixed(1)} /s` : '';
    return `Automatic 1-D gradient (${start.spacing} m cells${fit})`;
  }
  return start.modelVersion !== null ? `Saved model, version ${start.modelVersion}` : 'Saved model version';
}

/** Every setting as recorded, in the order the form asks for them. */
export function settingsRows(s: InversionSettings): { label: string; value: string }[] {
  return [
    { label: 'Iteration cap', value: String(s.maxIterations) },
    { label: 'Smoothing weight', value: s.smoothing === null ? 'automatic (lowered step by step towards χ² = 1)' : String(s.smoothing) },
    { label: 'Vertical smoothing, share of horizontal', value: String(s.verticalWeight) },
    { label: 'Damping towards the starting model', value: String(s.damping) },
    { label: 'Velocity bounds', value: `${s.vMin} – ${s.vMax} m/s` },
    { label: 'Eikonal scheme', value: s.order === 2 ? 'second order' : 'first order' },
    { label: 'Checkerboard test', value: s.checkerboard ? `yes, squares ${s.checkerSize === null ? 'sized automatically' : `of ${s.checkerSize} m`}` : 'no' },
  ];
}
