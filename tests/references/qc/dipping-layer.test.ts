/**
 * Dipping refractor, forward and reverse shots. Head-wave times from the dipping-layer formulas
 *   t_down = x·sin(ic + ξ)/V1 + 2h_A·cos(ic)/V1,   t_up = x·sin(ic − ξ)/V1 + 2h_B·cos(ic)/V1
 * give apparent velocities V_down = V1/sin(ic + ξ) and V_up = V1/sin(ic − ξ), from which
 *   ic = ½[asin(V1/V_down) + asin(V1/V_up)],  ξ = ½[asin(V1/V_down) − asin(V1/V_up)],  V2 = V1/sin ic
 * (Telford, Geldart & Sheriff 1990, "Applied Geophysics", 2nd ed., ch. 4, dipping refractor —
 * equation numbers from memory, not quoted). V1 = 600, V2 = 2400 m/s, ξ = 5°, h_A = 5 m under x = 0.
 */
import { describe, expect, it } from 'vitest';
import { findReciprocalPairs, fitApparentVelocity } from '../../../shared/qc';
import { criticalAngle, depthAt, firstArrival, relErr, shotPicks, type TwoLayer } from './refraction-model';

const dip = (5 * Math.PI) / 180;
const model: TwoLayer = { v1: 600, v2: 2400, h0: 5, dip };
const ic = criticalAngle(model);
const L = 60;
const shotA = shotPicks(model, 'A', 0, L, 2.5, 0); // shoots down-dip
const shotB = shotPicks(model, 'B', L, L, 2.5, 100); // shoots up-dip

describe('apparent velocities over a dipping refractor', () => {
  // Offsets 30–60 m are past both crossover distances (≈ 14.5 m down-dip, ≈ 23.7 m up-dip).
  const down = fitApparentVelocity(shotA, 30, 60)!;
  const up = fitApparentVelocity(shotB, 0, 30)!;

  it('the fit windows hold head-wave arrivals only (guards the set-up)', () => {
    for (const x of [30, 45, 60]) expect(firstArrival(model, 0, x)).toBeLessThan(x / model.v1);
    for (const x of [0, 15, 30]) expect(firstArrival(model, L, x)).toBeLessThan((L - x) / model.v1);
  });

  it('down-dip apparent velocity is V1/sin(ic + ξ) (1799.4 m/s), up-dip V1/sin(ic − ξ) (3643.9 m/s)', () => {
    expect(relErr(down.velocity, model.v1 / Math.sin(ic + dip))).toBeLessThan(1e-9);
    expect(relErr(up.velocity, model.v1 / Math.sin(ic - dip))).toBeLessThan(1e-9);
    // Hand-worked: ic = asin(0.25) = 14.4775°; 600/sin(19.4775°) = 1799.4; 600/sin(9.4775°) = 3643.9.
    expect(down.velocity).toBeCloseTo(1799.4, 1);
    expect(up.velocity).toBeCloseTo(3643.9, 1);
  });

  it('the two apparent velocities give back the dip, the true refractor velocity and h_A', () => {
    const a = Math.asin(model.v1 / down.velocity);
    const b = Math.asin(model.v1 / up.velocity);
    expect(((a - b) / 2) * (180 / Math.PI)).toBeCloseTo(5, 9);
    expect(relErr(model.v1 / Math.sin((a + b) / 2), model.v2)).toBeLessThan(1e-9);
    const icFit = (a + b) / 2;
    expect((down.intercept * model.v1) / (2 * Math.cos(icFit))).toBeCloseTo(model.h0, 9);
    // Up-dip intercept read at B's source gives the deeper perpendicular depth h_B = h_A + L·sin ξ.
    const tiB = up.intercept + up.slope * L;
    expect((tiB * model.v1) / (2 * Math.cos(icFit))).toBeCloseTo(depthAt(model, L), 9);
  });

  it('reciprocal times agree over a dipping refractor too (difference at rounding level, not flagged)', () => {
    const [pair] = findReciprocalPairs([...shotA, ...shotB]);
    expect([pair.shotA, pair.shotB]).toEqual(['A', 'B']);
    expect(pair.difference).toBeLessThan(1e-12);
    expect(pair.flagged).toBe(false);
    // Both equal L·sin(ic + ξ)/V1 + 2h_A·cos(ic)/V1.
    expect(pair.tAB).toBeCloseTo((L * Math.sin(ic + dip) + 2 * model.h0 * Math.cos(ic)) / model.v1, 12);
  });
});
