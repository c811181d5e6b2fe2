import type { ReactNode } from 'react';
import { CautionFooter } from './CautionFooter';

/** The frame of the pages one sees signed out (sign-in, a new password from a link): the name, a narrow column, the cautions. */
export function SignedOutShell({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <title>{`${title} · Timefield`}</title>
      <main className="flex flex-1 items-start justify-center px-4 pt-16 pb-12 sm:pt-24">
        <div className="w-full max-w-sm">
          <p className="text-3xl font-bold tracking-tight text-stone-900">Timefield</p>
          {children}
        </div>
      </main>
      <CautionFooter />
    </div>
  );
}
