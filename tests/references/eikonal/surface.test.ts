/**
 * Ground surface (issue 14). Exact answers come from outside the solver: straight lines
 * (distance / v) and the in-ground shortest path of scripts/bench/ground-path.ts, itself
 * checked here against plane geometry.
 */
import { describe, expect, it } from 'vitest';
import { groundPathLengths } from '../../../scripts/bench/ground-path';
import { measureSurfaceCase, slopeCase } from '../../../scripts/bench/surface-cases';

describe('in-ground shortest path (the reference)', () => {
  // V-shaped valley, vertex at (50, −10): a path between the two flanks bends at the vertex
  // (plane geometry: two straight legs); one between points that see each other is straight.
  const valley = [{ x: 0, z: 0 }, { x: 30, z: 0 }, { x: 50, z: -10 }, { x: 70, z: 0 }, { x: 100, z: 0 }];
  const vertex = { x: 50, z: -10 };
  it('wraps round the valley bottom between the flanks', () => {
    const s = { x: 40, z: -5 };
    const r = { x: 64, z: -3 };
    const [d] = groundPathLengths(valley, s, [r]);
    expect(d).toBeCloseTo(Math.hypot(s.x - vertex.x, s.z - vertex.z) + Math.hypot(r.x - vertex.x, r.z - vertex.z), 9);
  });
  it('is the straight distance when the segment stays in the ground', () => {
    const s = { x: 40, z: -5 };
    const r = { x: 60, z: -20 };
    const [d] = groundPathLengths(valley, s, [r]);
    expect(d).toBeCloseTo(Math.hypot(s.x - r.x, s.z - r.z), 9);
  });
  it('bends at both feet of a flat-topped hill, not at its top corners', () => {
    const hill = [{ x: 0, z: 0 }, { x: 40, z: 0 }, { x: 45, z: 5 }, { x: 55, z: 5 }, { x: 60, z: 0 }, { x: 100, z: 0 }];
    const [d] = groundPathLengths(hill, { x: 30, z: 0 }, [{ x: 70, z: 0 }]);
    expect(d).toBeCloseTo(40, 9); // the flat ground under the hill is a straight line in the ground
  });
});

describe('receivers 1–5 m from a shot on sloping ground (issue 14 target: ≤ 0.5 %)', () => {
  // Uniform ground, so the exact time is distance / v along the straight segment under the plane surface.
  for (const deg of [10, 15, 20, 25]) {
    it(`${deg}° slope`, () => {
      const e = measureSurfaceCase(slopeCase(deg));
      expect(e.count).toBe(14);
      expect(e.maxRel).toBeLessThanOrEqual(0.005);
    });
  }
});

describe('the start region never takes a time through air', () => {
  // Shot 1 m up the left flank of a 20° V valley; the right flank's geophones 1–5 m away see the
  // shot only across air, so the exact path wraps round the valley bottom (ground-path.ts). A
  // straight time through the air would run early by up to ~13 %.
  it('a geophone across the valley bottom keeps the in-ground path time', async () => {
    const { valleyCase } = await import('../../../scripts/bench/surface-cases');
    const c = valleyCase();
    const vx = 50;
    const shotX = vx - Math.cos((20 * Math.PI) / 180);
    c.shots = [{ x: shotX, z: c.raster.surfaceZ(shotX) }];
    c.geophones = [1.5, 2.5, 3.5, 4.5].map((d) => ({ x: vx + d, z: c.raster.surfaceZ(vx + d) }));
    const e = measureSurfaceCase(c);
    expect(e.count).toBe(4);
    // Through the air the 4.5 m geophone would be 0.13 ms early (law of cosines, 140° between the flanks).
    expect(e.earliestMs).toBeGreaterThan(-0.01);
  });
});

describe('uniform ground under a hill and a valley (issue 14 targets: max ≤ 0.05 ms, RMS ≤ 0.02 ms)', () => {
  // 0.5 m grid, surface shots, geophones every 2.5 m; exact = shortest in-ground path / v.
  it('Gaussian hill', async () => {
    const { hillCase } = await import('../../../scripts/bench/surface-cases');
    const e = measureSurfaceCase(hillCase());
    expect(e.maxMs).toBeLessThanOrEqual(0.05);
    expect(e.rmsMs).toBeLessThanOrEqual(0.02);
  });
  it('V-shaped valley', async () => {
    const { valleyCase } = await import('../../../scripts/bench/surface-cases');
    const e = measureSurfaceCase(valleyCase());
    expect(e.maxMs).toBeLessThanOrEqual(0.05);
    expect(e.rmsMs).toBeLessThanOrEqual(0.02);
  });
});
