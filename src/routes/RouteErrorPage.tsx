import { Fragment, type ReactNode } from 'react';
import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { CautionFooter } from '../components/CautionFooter';
import { NotFoundPage } from './NotFoundPage';

/**
 * The friendly error boundary for every route: an unexpected failure while rendering
 * a page lands here instead of leaving a blank screen.
 */
export function RouteErrorPage({ insideShell = false }: { insideShell?: boolean }) {
  const error = useRouteError();
  const Frame = insideShell ? Fragment : StandaloneFrame;
  if (isRouteErrorResponse(error) && error.status === 404) {
    return (
      <Frame>
        <NotFoundPage />
      </Frame>
    );
  }
  if (error) console.error(error); // keep the details for whoever opens the developer tools
  return (
    <Frame>
      <div role="alert" data-testid="error-boundary" className="max-w-prose py-8">
        <title>Something went wrong · Timefield</title>
        <h1 className="text-3xl font-bold tracking-tight text-stone-900">Something went wrong on this page</h1>
        <p className="mt-3 text-stone-700">
          Nothing you entered was lost on the server because of this. Reloading the page usually helps; if it keeps happening, tell
          your administrator what you were doing.
        </p>
        <p className="mt-6 flex gap-6">
          <button type="button" onClick={() => window.location.reload()} className="font-semibold text-accent-700 underline underline-offset-3">
            Reload the page
          </button>
          <Link to="/" reloadDocument className="font-semibold">
            Go to projects
          </Link>
        </p>
      </div>
    </Frame>
  );
}

/** Top bar and footer for errors that happen outside the app shell (or in it). */
function StandaloneFrame({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-stone-200 bg-white">
        <p className="mx-auto max-w-6xl px-4 py-3 text-xl font-bold tracking-tight text-stone-900 sm:px-6">Timefield</p>
      </header>
      <main className="mx-auto w-full max-w-6xl flex-1 px-4 py-10 sm:px-6">{children}</main>
      <CautionFooter />
    </div>
  );
}
