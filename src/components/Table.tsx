import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';

/**
 * A readable table: horizontal rules, light zebra rows. Below `minWidth` the box scrolls
 * sideways rather than squeezing every column into a tower of broken words. The box is
 * `relative` so visually hidden (absolutely positioned) header text stays inside it.
 */
export function DataTable({ caption, children, testId, minWidth = '40rem' }: { caption: string; children: ReactNode; testId?: string; minWidth?: string }) {
  return (
    <div className="relative overflow-x-auto rounded-lg border border-stone-200 bg-white">
      <table data-testid={testId} className="w-full border-collapse text-left" style={{ minWidth }}>
        <caption className="sr-only">{caption}</caption>
        {children}
      </table>
    </div>
  );
}

export function Th({ numeric, className = '', ...rest }: ThHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean }) {
  return (
    <th
      scope="col"
      className={`border-b border-stone-300 bg-stone-100 px-4 py-2 text-sm font-semibold text-stone-700 ${numeric ? 'text-right' : ''} ${className}`}
      {...rest}
    />
  );
}

export function Td({ numeric, className = '', ...rest }: TdHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean }) {
  return <td className={`px-4 py-2.5 align-top ${numeric ? 'text-right tabular-nums' : ''} ${className}`} {...rest} />;
}

export function Tr({ children, testId }: { children: ReactNode; testId?: string }) {
  return (
    <tr data-testid={testId} className="border-b border-stone-200 last:border-b-0 even:bg-stone-50">
      {children}
    </tr>
  );
}
