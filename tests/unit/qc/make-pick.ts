import type { QcPick } from '../../../shared/qc';

/** A pick with its time given in ms (as written in pick files), stored in s. */
export const pick = (index: number, shotId: string, sourceX: number, receiverX: number, timeMs: number, extra: Partial<QcPick> = {}): QcPick => ({
  index, shotId, sourceX, receiverX, time: timeMs / 1000, sigma: 0.0005, ...extra,
});

/** Shot over uniform ground at v m/s: receivers at the given x, t = |x − xs|/v. */
export const uniformShot = (shotId: string, xs: number, xs_: readonly number[], v: number, firstIndex = 0): QcPick[] =>
  xs_.map((x, k) => pick(firstIndex + k, shotId, xs, x, (Math.abs(x - xs) / v) * 1000));

/** 0, step, …, end. */
export const stations = (start: number, end: number, step: number): number[] =>
  Array.from({ length: Math.round((end - start) / step) + 1 }, (_, k) => start + k * step);
