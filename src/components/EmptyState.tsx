import type { ReactNode } from 'react';

/** An honest "nothing here yet" box, with an optional next step. */
export function EmptyState({ title, children, testId }: { title: string; children?: ReactNode; testId?: string }) {
  return (
    <div data-testid={testId} className="rounded-lg border border-dashed border-stone-300 bg-white/60 px-5 py-6 text-stone-700">
      <p className="font-semibold text-stone-800">{title}</p>
      {children && <div className="mt-1 text-stone-600">{children}</div>}
    </div>
  );
}
