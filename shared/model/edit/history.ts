/**
 * Undo/redo over immutable snapshots. Every committed change pushes the previous present onto
 * `past`; undo and redo move one snapshot between the stacks. A drag or a brush stroke changes
 * the present many times but is one step: `replacePresent` while it runs, then `commitFrom`
 * with the snapshot taken when it began.
 */
export interface History<T> {
  past: readonly T[];
  present: T;
  future: readonly T[];
  /** Most steps kept in `past` (the oldest fall off). */
  limit: number;
}

export const DEFAULT_HISTORY_LIMIT = 200;

export function createHistory<T>(present: T, limit = DEFAULT_HISTORY_LIMIT): History<T> {
  return { past: [], present, future: [], limit: Math.max(1, Math.floor(limit)) };
}

const capped = <T>(items: readonly T[], limit: number): readonly T[] => (items.length > limit ? items.slice(items.length - limit) : items);

/** A new step: the present becomes undoable, and anything that was undone is gone. */
export function pushState<T>(h: History<T>, next: T): History<T> {
  if (Object.is(next, h.present)) return h;
  return { ...h, past: capped([...h.past, h.present], h.limit), present: next, future: [] };
}

/** Change the present without a new step (during a drag). */
export function replacePresent<T>(h: History<T>, next: T): History<T> {
  return Object.is(next, h.present) ? h : { ...h, present: next };
}

/** End a gesture that began at `anchor`: one step from `anchor` to the current present. */
export function commitFrom<T>(h: History<T>, anchor: T): History<T> {
  if (Object.is(anchor, h.present)) return h;
  return { ...h, past: capped([...h.past, anchor], h.limit), future: [] };
}

export const canUndo = <T>(h: History<T>): boolean => h.past.length > 0;
export const canRedo = <T>(h: History<T>): boolean => h.future.length > 0;

export function undo<T>(h: History<T>): History<T> {
  if (!canUndo(h)) return h;
  const previous = h.past[h.past.length - 1];
  return { ...h, past: h.past.slice(0, -1), present: previous, future: [h.present, ...h.future] };
}

export function redo<T>(h: History<T>): History<T> {
  if (!canRedo(h)) return h;
  const [next, ...rest] = h.future;
  return { ...h, past: capped([...h.past, h.present], h.limit), present: next, future: rest };
}
