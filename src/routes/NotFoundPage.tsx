import { Link } from 'react-router';

export function NotFoundPage() {
  return (
    <div data-testid="not-found" className="max-w-prose py-8">
      <title>Page not found · Timefield</title>
      <p className="text-sm font-semibold tracking-wide text-stone-500 uppercase">Error 404</p>
      <h1 className="mt-1 text-3xl font-bold tracking-tight text-stone-900">There is no page at this address</h1>
      <p className="mt-3 text-stone-700">The link may be mistyped, or the page may have moved. Your projects are one click away.</p>
      <p className="mt-6">
        <Link to="/" className="font-semibold">
          Go to projects
        </Link>
      </p>
    </div>
  );
}
