import { Link } from 'react-router';
import { errorMessage, isApiError } from '../api/errors';

export function Loading({ what }: { what: string }) {
  return (
    <p role="status" className="py-8 text-stone-600">
      Loading {what}…
    </p>
  );
}

/** A failed load, with words that fit the status (not found, no access, or a retry). */
export function LoadError({ error, what, onRetry }: { error: unknown; what: string; onRetry?: () => void }) {
  let title = `We could not load the ${what}.`;
  let detail = errorMessage(error);
  if (isApiError(error, 404)) {
    title = `This ${what} does not exist.`;
    detail = 'It may have been removed, or the link may be mistyped.';
  } else if (isApiError(error, 403)) {
    title = `You do not have access to this ${what}.`;
    detail = 'Your role does not include it. Ask the project lead if you need access.';
  }
  const canRetry = onRetry && !isApiError(error, 404) && !isApiError(error, 403);
  return (
    <div role="alert" data-testid="load-error" className="rounded-lg border border-stone-300 bg-white px-5 py-6">
      <p className="text-lg font-semibold text-stone-900">{title}</p>
      <p className="mt-1 text-stone-700">{detail}</p>
      <p className="mt-3 flex gap-4">
        {canRetry && (
          <button type="button" onClick={onRetry} className="font-semibold text-accent-700 underline underline-offset-3">
            Try again
          </button>
        )}
        <Link to="/">Back to projects</Link>
      </p>
    </div>
  );
}
