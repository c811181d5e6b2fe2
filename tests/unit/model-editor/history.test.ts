import { describe, expect, it } from 'vitest';
import { canRedo, canUndo, commitFrom, createHistory, pushState, redo, replacePresent, undo } from '../../../shared/model/edit';

describe('undo/redo history', () => {
  it('undoes and redoes every step in order', () => {
    let h = createHistory('a');
    h = pushState(h, 'b');
    h = pushState(h, 'c');
    expect(h.present).toBe('c');
    h = undo(h);
    expect(h.present).toBe('b');
    h = undo(h);
    expect(h.present).toBe('a');
    expect(canUndo(h)).toBe(false);
    expect(undo(h)).toBe(h); // nothing left: same object back
    h = redo(h);
    h = redo(h);
    expect(h.present).toBe('c');
    expect(canRedo(h)).toBe(false);
  });

  it('a new step after an undo drops the undone future', () => {
    let h = pushState(pushState(createHistory(1), 2), 3);
    h = undo(h);
    h = pushState(h, 4);
    expect(h.present).toBe(4);
    expect(canRedo(h)).toBe(false);
    expect(undo(h).present).toBe(2);
  });

  it('a drag is one step: replacePresent while moving, commitFrom at the end', () => {
    let h = createHistory({ z: 0 });
    const anchor = h.present;
    for (let z = 1; z <= 10; z++) h = replacePresent(h, { z });
    h = commitFrom(h, anchor);
    expect(h.present).toEqual({ z: 10 });
    expect(h.past).toHaveLength(1);
    h = undo(h);
    expect(h.present).toBe(anchor);
    h = redo(h);
    expect(h.present).toEqual({ z: 10 });
  });

  it('pushing the same object is not a step, and the oldest steps fall off past the limit', () => {
    let h = createHistory(0, 3);
    expect(pushState(h, 0)).toBe(h);
    for (let i = 1; i <= 5; i++) h = pushState(h, i);
    expect(h.past).toEqual([2, 3, 4]);
    h = undo(undo(undo(h)));
    expect(h.present).toBe(2);
    expect(canUndo(h)).toBe(false);
  });
});
