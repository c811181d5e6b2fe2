/**
 * Layer methods against ground with a known answer (surveys.ts): refractor velocity within 5 %,
 * vertical depth under the geophones within 5 % (median) and 12 % (90th percentile) of the true
 * depth, with 0.3 ms noise on every pick (issue targets). Also the published check values of the
 * two-layer formulas: V1 = 500, V2 = 2000 m/s, h = 10 m gives an intercept time of 38.730 ms and
 * a crossover distance of 25.82 m (t_i = 2h·cos i_c / V1, x_c = 2h·√((V2+V1)/(V2−V1));
 * Telford, Geldart & Sheriff 1990, Applied Geophysics, 2nd ed., §4.3, eqs. 4.39–4.41).
 */
import { describe, expect, it } from 'vitest';
import { assignRefractors, interpretLayers, type LayerMethod } from '../../../shared/layers';
import { refractorBranches } from '../../../shared/layers/branches';
import { interceptRefractor } from '../../../shared/layers/intercept';
import { planarSurvey, quantile, undulatingSurvey, type Survey } from './surveys';

const METHODS: LayerMethod[] = ['grm', 'plus-minus', 'intercept'];

function check(survey: Survey, method: LayerMethod) {
  const r = interpretLayers(survey.shots, survey.surfaceZ, { method, layers: 2 });
  const errors = r.depths.map((d) => Math.abs(d.depth / survey.depth(d.x) - 1));
  return { r, errors, velocityError: Math.abs(r.velocities[1] / survey.v2 - 1), topError: Math.abs(r.velocities[0] / survey.v1 - 1) };
}

describe('two-layer check values (Telford et al. 1990 §4.3)', () => {
  const survey = planarSurvey(500, 2000, 10, 0, 0);

  it('the intercept time read from exact times is 38.730 ms', () => {
    const assignment = assignRefractors(survey.shots, 2);
    const r = interceptRefractor(refractorBranches(survey.shots, assignment, 1), 500, true);
    for (const line of r.lines) expect(2 * line.timeDepth * 1000).toBeCloseTo(38.73, 2);
    expect(r.velocity).toBeCloseTo(2000, 3);
  });

  it('the automatic assignment breaks each curve at the crossover distance, 25.82 m', () => {
    const assignment = assignRefractors(survey.shots, 2);
    survey.shots.forEach((shot, s) => {
      for (let i = 0; i < shot.times.length; i++) {
        const offset = Math.abs(shot.receivers[2 * i] - shot.source.x);
        // Geophones every 2 m: none lies within a metre of 25.82 m, so every pick is clear-cut.
        expect(assignment[s][i]).toBe(offset > 25.82 ? 1 : 0);
      }
    });
  });
});

describe.each(METHODS)('%s on planar ground with 0.3 ms noise', (method) => {
  it.each([
    { name: 'flat, 10 m', dip: 0, h0: 10 },
    { name: 'dipping 7° down to +x', dip: 7, h0: 8 },
    { name: 'dipping 9° up to +x', dip: -9, h0: 24 },
  ])('$name: velocities within 5 %, depths within 5 % (median) and 12 % (p90)', ({ dip, h0 }) => {
    const { r, errors, velocityError, topError } = check(planarSurvey(500, 2000, h0, dip, 0.0003, 3), method);
    expect(topError).toBeLessThan(0.05);
    expect(velocityError).toBeLessThan(0.05);
    expect(errors.length).toBeGreaterThanOrEqual(10);
    expect(quantile(errors, 0.5)).toBeLessThan(0.05);
    expect(quantile(errors, 0.9)).toBeLessThan(0.12);
    expect(r.warnings).toEqual([]);
  });
});

// The intercept-time method assumes planar ground; its figures on these surveys are in docs/interpretation.md.
describe.each(['grm', 'plus-minus'] as const)('%s on an undulating refractor, engine times on a 0.25 m grid, 0.3 ms noise', (method) => {
  it.each([
    { name: '4 m relief under ±2.5 m of topography', relief: 4, topography: 2.5 },
    { name: '6 m relief under flat ground', relief: 6, topography: 0 },
    // Met since the refractor velocity is read on the curves reduced to a datum (shared/layers/datum.ts): 7 % high before.
    { name: '6 m relief under ±2.5 m of topography', relief: 6, topography: 2.5 },
    { name: 'a flat refractor under ±2.5 m of topography', relief: 0, topography: 2.5 },
  ])('$name: velocities within 5 %, depths within 5 % (median) and 12 % (p90)', ({ relief, topography }) => {
    const { errors, velocityError, topError } = check(undulatingSurvey(600, 2400, relief, topography, 0.0003, 5), method);
    expect(topError).toBeLessThan(0.05);
    expect(velocityError).toBeLessThan(0.05);
    expect(errors.length).toBeGreaterThanOrEqual(10);
    expect(quantile(errors, 0.5)).toBeLessThan(0.05);
    expect(quantile(errors, 0.9)).toBeLessThan(0.12);
  });
});

describe('the drawn curves of a delay-time interpretation (functions.ts)', () => {
  // Flat two-layer ground, exact times: along the refractor the velocity-analysis function rises
  // at 1/V2 and every time-depth equals the delay h·cos(i_c)/V1 = h·√(1/V1² − 1/V2²)
  // (Palmer 1980; Hagedoorn 1959; Telford, Geldart & Sheriff 1990, §4.3): 10 m → 19.365 ms.
  const survey = planarSurvey(500, 2000, 10, 0, 0);
  const delay = 10 * Math.sqrt(1 / 500 ** 2 - 1 / 2000 ** 2);
  for (const method of ['plus-minus', 'grm'] as const) {
    it(`${method}: t_V has slope 1/V2 and t_G is the delay time under every geophone`, () => {
      const r = interpretLayers(survey.shots, survey.surfaceZ, { method, layers: 2 });
      expect(r.functions).toHaveLength(1);
      const f = r.functions[0];
      expect(f.xy).toBe(method === 'grm' ? r.xy : 0);
      expect(f.pairs.length).toBeGreaterThan(0);
      for (const p of f.pairs) {
        for (let i = 1; i < p.x.length; i++) expect((p.velocityFn[i] - p.velocityFn[i - 1]) / (p.x[i] - p.x[i - 1])).toBeCloseTo(1 / 2000, 7);
        for (const t of p.timeDepth) expect(t * 1000).toBeCloseTo(delay * 1000, 1);
      }
    });
  }
});
