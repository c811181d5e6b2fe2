import type { ReactNode } from 'react';

/** A white card that holds a form. */
export function Panel({ title, children, id }: { title: string; children: ReactNode; id?: string }) {
  return (
    <div id={id} className="mt-4 rounded-lg border border-stone-200 bg-white p-5 shadow-xs">
      <h3 className="mb-4 text-lg font-semibold text-stone-900">{title}</h3>
      {children}
    </div>
  );
}
