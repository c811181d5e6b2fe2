import type { ReportStatus } from '../../api/types';
import { REPORT_STATUS_LABELS } from './wording';

const TONES: Record<ReportStatus, string> = {
  draft: 'bg-stone-100 text-stone-800 ring-stone-300',
  submitted: 'bg-accent-50 text-accent-800 ring-accent-200',
  returned: 'bg-amber-50 text-amber-900 ring-amber-200',
  approved: 'bg-emerald-50 text-emerald-900 ring-emerald-200',
  shared: 'bg-emerald-700 text-white ring-emerald-700',
};

export function ReportStatusBadge({ status }: { status: ReportStatus }) {
  return (
    <span data-testid="report-status" data-status={status} className={`inline-block rounded-full px-2.5 py-0.5 text-sm font-semibold whitespace-nowrap ring-1 ring-inset ${TONES[status] ?? TONES.draft}`}>
      {REPORT_STATUS_LABELS[status] ?? status}
    </span>
  );
}
