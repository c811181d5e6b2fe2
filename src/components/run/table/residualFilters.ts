import type { ResidualRow } from '../../../api/types';

/** What the residual table shows; null means "no limit". */
export interface ResidualFilter {
  shotId: string | null;
  xMin: number | null;
  xMax: number | null;
  /** Show only picks with |residual| > k·σ. */
  k: number | null;
  includeExcluded: boolean;
}

export const NO_FILTER: ResidualFilter = { shotId: null, xMin: null, xMax: null, k: null, includeExcluded: true };

export function filterResiduals(rows: readonly ResidualRow[], f: ResidualFilter): ResidualRow[] {
  return rows.filter(
    (r) =>
      (f.shotId === null || r.shotId === f.shotId) &&
      (f.xMin === null || r.receiverX >= f.xMin) &&
      (f.xMax === null || r.receiverX <= f.xMax) &&
      (f.k === null || Math.abs(r.residualMs) > f.k * r.sigmaMs) &&
      (f.includeExcluded || !r.excluded),
  );
}

export type ResidualSortKey = 'shotId' | 'receiverX' | 'observedMs' | 'computedMs' | 'residualMs' | 'absResidual' | 'sigmaMs' | 'normalised';
export type SortDirection = 'asc' | 'desc';

/** Shot ids sort as people read them: S2 before S10. */
const shotCollator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });
export const compareShotIds = (a: string, b: string): number => shotCollator.compare(a, b);

function value(r: ResidualRow, key: Exclude<ResidualSortKey, 'shotId'>): number {
  if (key === 'absResidual') return Math.abs(r.residualMs);
  return r[key];
}

/** A stable sort; ties keep shot, then receiver order, so the table never shuffles. */
export function sortResiduals(rows: readonly ResidualRow[], key: ResidualSortKey, dir: SortDirection): ResidualRow[] {
  const sign = dir === 'asc' ? 1 : -1;
  const natural = (a: ResidualRow, b: ResidualRow) => compareShotIds(a.shotId, b.shotId) || a.receiverX - b.receiverX || a.pickIndex - b.pickIndex;
  return [...rows].sort((a, b) => {
    const primary = key === 'shotId' ? compareShotIds(a.shotId, b.shotId) : value(a, key) - value(b, key);
    return sign * primary || natural(a, b);
  });
}

/** Parse a number typed into a filter box; blank is "no limit", and anything unreadable too (flagged by the caller). */
export function parseLimit(text: string): { value: number | null; ok: boolean } {
  const t = text.trim();
  if (t === '') return { value: null, ok: true };
  const v = Number(t);
  return Number.isFinite(v) ? { value: v, ok: true } : { value: null, ok: false };
}
