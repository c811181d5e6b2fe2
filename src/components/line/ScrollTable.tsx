import type { ReactNode } from 'react';

/**
 * A table in a box of limited height whose header row stays in view while the rows scroll,
 * for long lists (stations, picks) that would otherwise push everything else off the page.
 */
export function ScrollTable({ caption, children, testId, minWidth = '30rem', maxHeight = '34rem' }: { caption: string; children: ReactNode; testId?: string; minWidth?: string; maxHeight?: string }) {
  return (
    <div className="relative overflow-auto rounded-lg border border-stone-200 bg-white" style={{ maxHeight }}>
      <table data-testid={testId} className="w-full border-collapse text-left [&_thead_th]:sticky [&_thead_th]:top-0 [&_thead_th]:z-10" style={{ minWidth }}>
        <caption className="sr-only">{caption}</caption>
        {children}
      </table>
    </div>
  );
}
