/**
 * Worked two-layer example: V1 = 600 m/s, V2 = 2400 m/s, h = 6 m, receivers every 2.5 m over 60 m,
 * shots at both ends and in the middle. Forward times from the textbook formulas (refraction-model.ts,
 * Telford, Geldart & Sheriff 1990, "Applied Geophysics", 2nd ed., ch. 4). The QC must give back the
 * model: branch slopes 1/V1 and 1/V2, the intercept time, the crossover distance and the depth.
 */
import { describe, expect, it } from 'vitest';
import { findReciprocalPairs, fitApparentVelocity, flagSuspectPicks, type QcPick } from '../../../shared/qc';
import { criticalAngle, relErr, shotPicks, type TwoLayer } from './refraction-model';

const model: TwoLayer = { v1: 600, v2: 2400, h0: 6, dip: 0 };
const ic = criticalAngle(model); // sin ic = 1/4
const L = 60;
const forward = shotPicks(model, 'S01', 0, L, 2.5, 0);
const middle = shotPicks(model, 'S02', 30, L, 2.5, 100);
const reverse = shotPicks(model, 'S03', L, L, 2.5, 200);
const all = [...forward, ...middle, ...reverse];

// Intercept time ti = 2h·cos(ic)/V1 = 12 · (√15/4) / 600 = 19.365 ms (Telford et al. 1990, ch. 4).
const ti = (2 * model.h0 * Math.cos(ic)) / model.v1;
// Crossover distance x_c = 2h·√((V2+V1)/(V2−V1)) = 12·√(3000/1800) = 15.49 m (same source).
const xCross = 2 * model.h0 * Math.sqrt((model.v2 + model.v1) / (model.v2 - model.v1));

describe('apparent velocities of a flat two-layer model', () => {
  it('the worked numbers are what the formulas say (guards the set-up)', () => {
    expect(ti * 1000).toBeCloseTo(19.365, 3);
    expect(xCross).toBeCloseTo(15.492, 3);
  });

  it('direct branch of the forward shot (0 ≤ x ≤ 15 m, pick at the source included) gives V1', () => {
    const fit = fitApparentVelocity(forward, 0, 15)!;
    expect(fit.n).toBe(7);
    expect(relErr(fit.velocity, model.v1)).toBeLessThan(1e-9);
    expect(Math.abs(fit.intercept)).toBeLessThan(1e-12);
    expect(fit.r2).toBeCloseTo(1, 12);
    expect(fit.rmsMs).toBeLessThan(1e-9);
  });

  it('head-wave branch of the forward shot (17.5–60 m) gives V2 and intercept 2h·cos(ic)/V1', () => {
    const fit = fitApparentVelocity(forward, 17.5, 60)!;
    expect(fit.n).toBe(18);
    expect(fit.slope).toBeGreaterThan(0);
    expect(relErr(fit.velocity, model.v2)).toBeLessThan(1e-9);
    expect(relErr(fit.intercept, ti)).toBeLessThan(1e-9);
    expect([fit.xMin, fit.xMax]).toEqual([17.5, 60]);
  });

  it('reverse shot: same velocities with negative slopes; its intercept time is the line at the source', () => {
    const direct = fitApparentVelocity(reverse, 45, 60)!;
    const head = fitApparentVelocity(reverse, 0, 42.5)!;
    expect(direct.slope).toBeLessThan(0);
    expect(relErr(direct.velocity, model.v1)).toBeLessThan(1e-9);
    expect(relErr(head.velocity, model.v2)).toBeLessThan(1e-9);
    expect(relErr(head.intercept + head.slope * L, ti)).toBeLessThan(1e-9);
  });

  it('the fitted lines cross at x_c and the intercept gives back h = ti·V1·V2 / (2√(V2²−V1²))', () => {
    const d = fitApparentVelocity(forward, 0, 15)!;
    const h = fitApparentVelocity(forward, 17.5, 60)!;
    const crossing = (h.intercept - d.intercept) / (d.slope - h.slope);
    expect(relErr(crossing, xCross)).toBeLessThan(1e-9);
    // Depth from intercept time (Telford et al. 1990, ch. 4; the flat-layer formula rearranged).
    const depth = (h.intercept * d.velocity * h.velocity) / (2 * Math.sqrt(h.velocity ** 2 - d.velocity ** 2));
    expect(depth).toBeCloseTo(model.h0, 9);
  });

  it('clean synthetic first arrivals raise no suspect-pick flag (pick at the source with t = 0 is fine)', () => {
    expect(forward[0].time).toBe(0);
    expect(flagSuspectPicks(all)).toEqual([]);
  });
});

describe('reciprocal times over the flat model', () => {
  it('end-to-end and middle shots agree exactly: t(A→B) = t(B→A), ray paths being reversible', () => {
    const pairs = findReciprocalPairs(all);
    expect(pairs.map((p) => [p.shotA, p.shotB])).toEqual([['S01', 'S02'], ['S01', 'S03'], ['S02', 'S03']]);
    for (const p of pairs) {
      expect(p.difference).toBe(0);
      expect(p.flagged).toBe(false);
    }
    const ends = pairs[1];
    // t(0 → 60 m) = 60/V2 + ti = 44.365 ms, the pick of S01 at x = 60 and of S03 at x = 0.
    expect(ends.tAB).toBeCloseTo(L / model.v2 + ti, 12);
    expect([ends.indexAB, ends.indexBA]).toEqual([24, 200]);
  });

  const perturbed = (deltaS: number): QcPick[] =>
    all.map((p) => (p.index === 200 ? { ...p, time: p.time + deltaS } : p));
  const endPair = (picks: QcPick[], toleranceS?: number) =>
    findReciprocalPairs(picks, { toleranceS }).find((p) => p.shotA === 'S01' && p.shotB === 'S03')!;

  it('a pick 2.5 ms late is flagged at the 2 ms tolerance (common practice, no source), not at 3 ms', () => {
    const pair = endPair(perturbed(0.0025));
    expect(pair.difference).toBeCloseTo(0.0025, 12);
    expect(pair.flagged).toBe(true);
    expect(endPair(perturbed(0.0025), 0.003).flagged).toBe(false);
  });

  it('a pick 1.5 ms late is within the 2 ms tolerance and not flagged; other pairs stay clean', () => {
    const pairs = findReciprocalPairs(perturbed(0.0015));
    expect(pairs.filter((p) => p.flagged)).toEqual([]);
    expect(endPair(perturbed(0.0015)).difference).toBeCloseTo(0.0015, 12);
  });
});
