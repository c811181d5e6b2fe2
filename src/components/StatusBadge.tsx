import type { ProjectStatus } from '../api/types';
import { STATUS_LABELS } from '../lib/format';

const TONES: Record<ProjectStatus, string> = {
  active: 'bg-accent-50 text-accent-800 ring-accent-200',
  on_hold: 'bg-amber-50 text-amber-900 ring-amber-200',
  closed: 'bg-stone-100 text-stone-700 ring-stone-300',
};

export function StatusBadge({ status }: { status: ProjectStatus }) {
  return (
    <span className={`inline-block rounded-full px-2.5 py-0.5 text-sm font-semibold ring-1 ring-inset ${TONES[status] ?? TONES.closed}`}>
      {STATUS_LABELS[status] ?? status}
    </span>
  );
}
