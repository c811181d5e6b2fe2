import type { ReactNode } from 'react';
import { Link } from 'react-router';

export interface Crumb {
  label: string;
  to?: string;
}

/** Page title with an optional trail back up the hierarchy and a line of facts below it. */
export function PageHeader({ title, crumbs = [], children }: { title: string; crumbs?: Crumb[]; children?: ReactNode }) {
  return (
    <header className="mb-8">
      {crumbs.length > 0 && (
        <nav aria-label="Breadcrumb" className="mb-2 text-sm text-stone-600">
          <ol className="flex flex-wrap gap-x-2">
            {crumbs.map((c, i) => (
              <li key={i} className="flex gap-2">
                {c.to ? <Link to={c.to}>{c.label}</Link> : <span>{c.label}</span>}
                <span aria-hidden="true" className="text-stone-400">
                  /
                </span>
              </li>
            ))}
          </ol>
        </nav>
      )}
      <h1 className="text-3xl font-bold tracking-tight text-stone-900">{title}</h1>
      {children && <div className="mt-3 text-stone-700">{children}</div>}
    </header>
  );
}
