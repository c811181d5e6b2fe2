import { useId, type ReactNode } from 'react';

/** A titled block of a page; the heading names the region for assistive technology. */
export function Section({ title, description, actions, children }: { title: string; description?: ReactNode; actions?: ReactNode; children: ReactNode }) {
  const id = useId();
  return (
    <section aria-labelledby={id} className="mb-10">
      <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id={id} className="text-xl font-semibold text-stone-900">
            {title}
          </h2>
          {description && <p className="text-stone-600">{description}</p>}
        </div>
        {actions}
      </div>
      {children}
    </section>
  );
}
