import { Link } from 'react-router';
import type { InversionView } from '../../../shared/schemas/inversions';
import { when } from '../run/format';

/** A failed or cancelled inversion says so plainly, with the worker's message when there is one. */
export function InversionOutcome({ inversion }: { inversion: InversionView }) {
  const back = `/lines/${inversion.lineId}?tab=inversions`;
  if (inversion.status === 'failed') {
    return (
      <div role="alert" data-testid="inversion-outcome" className="mb-8 rounded-lg border border-red-300 bg-red-50 px-5 py-4 text-red-900">
        <p className="text-lg font-semibold">This inversion failed{inversion.finishedAt ? ` (${when(inversion.finishedAt)})` : ''}.</p>
        <p className="mt-1">{inversion.error || 'The worker stopped without saying why. Try starting it again; if it fails again, tell your administrator.'}</p>
        <p className="mt-2 text-sm">
          <Link to={back}>Start another inversion</Link>
        </p>
      </div>
    );
  }
  return (
    <div role="status" data-testid="inversion-outcome" className="mb-8 rounded-lg border border-amber-300 bg-amber-50 px-5 py-4 text-amber-950">
      <p className="text-lg font-semibold">This inversion was cancelled{inversion.finishedAt ? ` (${when(inversion.finishedAt)})` : ''}.</p>
      <p className="mt-1">
        {inversion.error || `It stopped after ${inversion.progress.iteration} of at most ${inversion.progress.maxIterations} iterations.`}{' '}
        <Link to={back}>Start a new one</Link> when you are ready.
      </p>
    </div>
  );
}
