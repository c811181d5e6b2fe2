import { Link } from 'react-router';
import type { RunDetail } from '../../../api/types';
import { when } from '../format';

/** A failed or cancelled run says so plainly, with the worker's message when there is one. */
export function RunOutcome({ run }: { run: RunDetail }) {
  if (run.status === 'failed') {
    return (
      <div role="alert" data-testid="run-outcome" className="mb-8 rounded-lg border border-red-300 bg-red-50 px-5 py-4 text-red-900">
        <p className="text-lg font-semibold">This run failed{run.finishedAt ? ` (${when(run.finishedAt)})` : ''}.</p>
        <p className="mt-1">{run.error || 'The solver stopped without saying why. Try starting the run again; if it fails again, tell your administrator.'}</p>
        <p className="mt-2 text-sm">
          Nothing from this run was stored, so there are no results to show. <Link to={`/lines/${run.lineId}/runs`}>Start another run</Link>
        </p>
      </div>
    );
  }
  return (
    <div role="status" data-testid="run-outcome" className="mb-8 rounded-lg border border-amber-300 bg-amber-50 px-5 py-4 text-amber-950">
      <p className="text-lg font-semibold">This run was cancelled{run.finishedAt ? ` (${when(run.finishedAt)})` : ''}.</p>
      <p className="mt-1">
        {run.error || `It stopped after ${run.progress.done} of ${run.progress.total} shots.`} A cancelled run keeps no results.{' '}
        <Link to={`/lines/${run.lineId}/runs`}>Start a new run</Link> when you are ready.
      </p>
    </div>
  );
}
