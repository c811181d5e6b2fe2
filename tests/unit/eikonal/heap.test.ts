/** The indexed heap must hand nodes back in key order, with keys lowered and raised on the way (checked against Array.prototype.sort). */
import { describe, expect, it } from 'vitest';
import { IndexedMinHeap } from '../../../shared/eikonal/heap';

function rng(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
}

describe('IndexedMinHeap', () => {
  it('pops in ascending key order after pushes, decreases and raises', () => {
    const rand = rng(7);
    const n = 2000;
    const heap = new IndexedMinHeap(n);
    const key = new Float64Array(n);
    for (let i = 0; i < n; i++) heap.pushOrDecrease(i, (key[i] = rand()));
    for (let k = 0; k < 3000; k++) {
      const i = Math.floor(rand() * n);
      const v = rand();
      if (v < key[i]) heap.pushOrDecrease(i, (key[i] = v));
      else heap.update(i, (key[i] = v));
    }
    const expected = Array.from(key.keys()).sort((a, b) => key[a] - key[b]);
    const got: number[] = [];
    while (heap.size > 0) got.push(heap.pop());
    expect(got.map((i) => key[i])).toEqual(expected.map((i) => key[i]));
    expect(new Set(got).size).toBe(n);
  });
  it('never raises a key through pushOrDecrease, and clear() empties it', () => {
    const heap = new IndexedMinHeap(4);
    heap.pushOrDecrease(1, 0.5);
    heap.pushOrDecrease(1, 0.9);
    heap.pushOrDecrease(2, 0.7);
    expect(heap.peekKey()).toBe(0.5);
    heap.clear();
    expect(heap.size).toBe(0);
    expect(heap.has(1)).toBe(false);
  });
});
