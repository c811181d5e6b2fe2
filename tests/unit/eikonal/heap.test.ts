/**
 * The compiled march's indexed heap (shared/eikonal/kernel/march.as.ts, through kernel.ts) must hand
 * nodes back in key order, with keys lowered and raised on the way — checked against
 * Array.prototype.sort, a general-purpose reference.
 */
import { describe, expect, it } from 'vitest';
import { MarchKernel } from '../../../shared/eikonal/kernel';

function rng(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
}

/** A kernel whose heap holds at least n nodes (one per node of the bordered grid). */
function heapFor(n: number) {
  const side = Math.ceil(Math.sqrt(n));
  return new MarchKernel(side, side, 1, 1, 0, 0).heap;
}

describe('march kernel heap', () => {
  it('pops in ascending key order after pushes, decreases and raises', () => {
    const rand = rng(7);
    const n = 2000;
    const heap = heapFor(n);
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
    const heap = heapFor(4);
    heap.pushOrDecrease(1, 0.5);
    heap.pushOrDecrease(1, 0.9);
    heap.pushOrDecrease(2, 0.7);
    expect(heap.pop()).toBe(1);
    heap.pushOrDecrease(3, 0.2);
    heap.clear();
    expect(heap.size).toBe(0);
    heap.pushOrDecrease(2, 0.4); // a node cleared out comes back as new
    expect(heap.size).toBe(1);
    expect(heap.pop()).toBe(2);
  });
});
