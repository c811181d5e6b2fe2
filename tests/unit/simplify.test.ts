import { describe, expect, it } from 'vitest';
import { simplifyPolyline } from '../../shared/geometry/simplify';

// Ramer (1972) / Douglas & Peucker (1973): every dropped point lies within the tolerance of the kept line.
describe('simplifyPolyline', () => {
  it('reduces a straight ray sampled in small steps to its two ends', () => {
    const pts = new Float64Array(202);
    for (let i = 0; i <= 100; i++) {
      pts[2 * i] = i * 0.1;
      pts[2 * i + 1] = 0 - i * 0.05;
    }
    expect(Array.from(simplifyPolyline(pts, 0.01))).toEqual([0, 0, 10, -5].map(Math.fround));
  });

  it('keeps a corner and leaves every dropped point within the tolerance', () => {
    // A head-wave-like path: down, along, up.
    const path: number[] = [];
    for (let i = 0; i <= 10; i++) path.push(i, 0 - i);
    for (let i = 11; i <= 40; i++) path.push(i, -10);
    for (let i = 41; i <= 50; i++) path.push(i, -10 + (i - 40));
    const pts = Float64Array.from(path);
    const out = simplifyPolyline(pts, 0.05);
    expect(Array.from(out)).toEqual([0, 0, 10, -10, 40, -10, 50, 0]);
    const wavy = pts.map((v, i) => (i % 2 ? v + 0.02 * Math.sin(i) : v));
    const kept = simplifyPolyline(wavy, 0.05);
    for (let i = 0; i < wavy.length / 2; i++) {
      let best = Infinity;
      for (let k = 0; k + 3 < kept.length; k += 2) {
        const [ax, az, bx, bz] = [kept[k], kept[k + 1], kept[k + 2], kept[k + 3]];
        const t = Math.max(0, Math.min(1, ((wavy[2 * i] - ax) * (bx - ax) + (wavy[2 * i + 1] - az) * (bz - az)) / ((bx - ax) ** 2 + (bz - az) ** 2)));
        best = Math.min(best, Math.hypot(wavy[2 * i] - ax - t * (bx - ax), wavy[2 * i + 1] - az - t * (bz - az)));
      }
      expect(best).toBeLessThanOrEqual(0.05 + 1e-6);
    }
  });
});
