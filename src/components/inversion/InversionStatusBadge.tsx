import type { InversionView } from '../../../shared/schemas/inversions';
import { INVERSION_STATUS_LABELS } from './wording';

/** Tones per job state, shared by every job kind's badge (inversions, ensembles). */
export const STATUS_TONES: Record<InversionView['status'], string> = {
  queued: 'bg-stone-100 text-stone-800 ring-stone-300',
  running: 'bg-accent-50 text-accent-800 ring-accent-200',
  done: 'bg-emerald-50 text-emerald-900 ring-emerald-200',
  failed: 'bg-red-50 text-red-900 ring-red-200',
  cancelled: 'bg-amber-50 text-amber-900 ring-amber-200',
};

export function InversionStatusBadge({ status }: { status: InversionView['status'] }) {
  return (
    <span data-testid="inversion-status" data-status={status} className={`inline-block rounded-full px-2.5 py-0.5 text-sm font-semibold ring-1 ring-inset ${STATUS_TONES[status] ?? STATUS_TONES.queued}`}>
      {INVERSION_STATUS_LABELS[status] ?? status}
    </span>
  );
}
