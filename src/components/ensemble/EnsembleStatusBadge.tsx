import type { EnsembleView } from '../../../shared/schemas/ensembles';

const LABELS: Record<EnsembleView['status'], string> = { queued: 'Waiting for workers', running: 'Members running', done: 'Combined', failed: 'Failed', cancelled: 'Cancelled' };
const TONES: Record<EnsembleView['status'], string> = {
  queued: 'bg-stone-100 text-stone-800 ring-stone-300',
  running: 'bg-accent-50 text-accent-800 ring-accent-200',
  done: 'bg-emerald-50 text-emerald-900 ring-emerald-200',
  failed: 'bg-red-50 text-red-900 ring-red-200',
  cancelled: 'bg-amber-50 text-amber-900 ring-amber-200',
};

export function EnsembleStatusBadge({ status }: { status: EnsembleView['status'] }) {
  return (
    <span data-testid="ensemble-status" data-status={status} className={`inline-block rounded-full px-2.5 py-0.5 text-sm font-semibold ring-1 ring-inset ${TONES[status]}`}>
      {LABELS[status]}
    </span>
  );
}
