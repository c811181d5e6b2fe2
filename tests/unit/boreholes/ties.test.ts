/** Ground from stations and ties of logged contacts to an interpreted surface; hand-computed values. */
import { describe, expect, it } from 'vitest';
import { boreholeTies, groundAt } from '../../../shared/boreholes';

describe('groundAt', () => {
  const stations = [
    { x: 10, z: 102 },
    { x: 0, z: 100 },
    { x: 20, z: 101 },
  ];
  it('is linear between stations, exact at one, and null outside the stations', () => {
    expect(groundAt(stations, 5)).toBe(101);
    expect(groundAt(stations, 15)).toBe(101.5);
    expect(groundAt(stations, 20)).toBe(101);
    expect(groundAt(stations, -0.1)).toBeNull();
    expect(groundAt([], 3)).toBeNull();
  });
});

describe('boreholeTies', () => {
  const holes = [
    { id: 'a', name: 'BH1', x: 10, contacts: [{ depth: 1, material: 'clay', rockTop: false }, { depth: 6.8, material: 'sandstone', rockTop: true }] },
    { id: 'b', name: 'TP2', x: 50, contacts: [{ depth: 0.5, material: 'gravel', rockTop: false }, { depth: 2, material: 'rock', rockTop: false }] },
    { id: 'c', name: 'BH3', x: 200, contacts: [{ depth: 4, material: 'rock', rockTop: true }] },
  ];
  const depthAt = (x: number) => (x > 100 ? null : 7 + x / 100);
  it('ties the top of rock where marked, every contact where none is, and leaves holes off the surface without a number', () => {
    const ties = boreholeTies(holes, depthAt);
    expect(ties.map((t) => [t.name, t.contactDepth, t.interpretedDepth, t.differenceM])).toEqual([
      ['BH1', 6.8, 7.1, 0.3],
      ['TP2', 0.5, 7.5, 7],
      ['TP2', 2, 7.5, 5.5],
      ['BH3', 4, null, null],
    ]);
  });
});
