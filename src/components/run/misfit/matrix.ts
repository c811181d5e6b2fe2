import { compareShotIds } from '../table/residualFilters';

/**
 * Picks laid out as shots (rows) × receiver positions (columns). Receivers are matched to the
 * millimetre, which is finer than any geophone spacing.
 */
export interface Matrix<T> {
  shots: string[];
  receivers: number[];
  /** cells[row][column]; null where a shot has no pick at that receiver. */
  cells: (T | null)[][];
}

export const receiverKey = (x: number): number => Math.round(x * 1000);

export function buildMatrix<T>(items: readonly T[], shotOf: (item: T) => string, xOf: (item: T) => number): Matrix<T> {
  const shots = [...new Set(items.map(shotOf))].sort(compareShotIds);
  const keys = [...new Set(items.map((i) => receiverKey(xOf(i))))].sort((a, b) => a - b);
  const row = new Map(shots.map((s, i) => [s, i]));
  const col = new Map(keys.map((k, i) => [k, i]));
  const cells: (T | null)[][] = shots.map(() => keys.map(() => null));
  for (const item of items) cells[row.get(shotOf(item))!]![col.get(receiverKey(xOf(item)))!] = item;
  return { shots, receivers: keys.map((k) => k / 1000), cells };
}
