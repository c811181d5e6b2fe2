import type { EnsembleView } from '../../../shared/schemas/ensembles';
import { STATUS_TONES } from '../inversion/InversionStatusBadge';

const LABELS: Record<EnsembleView['status'], string> = { queued: 'Waiting for workers', running: 'Members running', done: 'Combined', failed: 'Failed', cancelled: 'Cancelled' };

export function EnsembleStatusBadge({ status }: { status: EnsembleView['status'] }) {
  return (
    <span data-testid="ensemble-status" data-status={status} className={`inline-block rounded-full px-2.5 py-0.5 text-sm font-semibold ring-1 ring-inset ${STATUS_TONES[status]}`}>
      {LABELS[status]}
    </span>
  );
}
