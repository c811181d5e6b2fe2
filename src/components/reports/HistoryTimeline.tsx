import type { ReportEvent } from '../../api/types';
import { dateTime, EVENT_LABELS } from './wording';

const DOT: Record<ReportEvent['action'], string> = {
  create: 'bg-stone-400',
  submit: 'bg-accent-600',
  return: 'bg-amber-500',
  approve: 'bg-emerald-600',
  share: 'bg-emerald-800',
};

/** Who did what to the report and when, oldest first, with their comments in full (for a client: what and when only). */
export function HistoryTimeline({ events }: { events: ReportEvent[] }) {
  if (events.length === 0) return <p className="text-stone-600">No steps recorded yet.</p>;
  return (
    <ol data-testid="report-history" className="relative ml-2 border-l-2 border-stone-200">
      {events.map((e, i) => (
        <li key={i} data-testid="history-entry" data-action={e.action} className="relative mb-5 pl-6 last:mb-0">
          <span aria-hidden="true" className={`absolute top-2 -left-[7px] h-3 w-3 rounded-full ring-2 ring-white ${DOT[e.action] ?? DOT.create}`} />
          <p>
            {/* A client's history has no actor at all (undefined); null is an account since removed. */}
            {e.actor === undefined ? (
              <span className="text-stone-800">{EVENT_LABELS[e.action] ?? e.action}</span>
            ) : (
              <>
                <strong className="text-stone-900">{e.actor ?? 'A former member'}</strong> <span className="text-stone-800">{(EVENT_LABELS[e.action] ?? e.action).toLowerCase()}</span>
              </>
            )}
          </p>
          <p className="text-sm text-stone-600">
            <time dateTime={e.at}>{dateTime(e.at)}</time>
          </p>
          {e.comment && (
            <blockquote className="mt-1 max-w-prose rounded-md border-l-4 border-stone-300 bg-stone-50 px-3 py-2 whitespace-pre-wrap text-stone-800">
              {e.comment}
            </blockquote>
          )}
        </li>
      ))}
    </ol>
  );
}
