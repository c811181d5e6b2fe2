/**
 * Suspect-pick rules on hand-worked numbers. Ground at 500 m/s, receivers every 2.5 m → 5 ms per station.
 * Thresholds 100 and 8000 m/s are the defaults (common practice, no source). Most cases check the strict
 * rules (sigmaAllowance 0); the last block checks the allowance for pick uncertainty.
 */
import { describe, expect, it } from 'vitest';
import { flagSuspectPicks, type QcPick } from '../../../shared/qc';
import { pick, stations, uniformShot } from './make-pick';

const base = () => uniformShot('S1', 0, stations(0, 20, 2.5), 500); // x = 0 … 20, index = x/2.5
/** The strict rules: no allowance for pick uncertainty. */
const strict = (picks: QcPick[], options: Parameters<typeof flagSuspectPicks>[1] = {}) => flagSuspectPicks(picks, { sigmaAllowance: 0, ...options });
const withTime = (picks: QcPick[], x: number, timeMs: number) =>
  picks.map((p) => (p.receiverX === x ? { ...p, time: timeMs / 1000 } : p));

describe('flagSuspectPicks', () => {
  it('clean picks, empty input and a shot with one pick give no flags', () => {
    expect(strict(base())).toEqual([]);
    expect(strict([])).toEqual([]);
    expect(strict([pick(0, 'S1', 0, 10, 20)])).toEqual([]);
  });

  it('too fast: 2.5 m in 0.25 ms is 10000 m/s > 8000 m/s; the farther pick is flagged', () => {
    const flags = strict(withTime(base(), 10, 15.25)); // x = 7.5 is at 15 ms
    expect(flags).toEqual([{
      index: 4, shotId: 'S1', kind: 'too_fast',
      message: 'apparent velocity 10000 m/s between x = 7.5 and 10.0 m exceeds 8000 m/s',
    }]);
    expect(strict(withTime(base(), 10, 15.25), { vMax: 12000 })).toEqual([]);
  });

  it('too slow: the last pick 2.5 m beyond in 30 ms is 83 m/s < 100 m/s', () => {
    const flags = strict(withTime(base(), 20, 65)); // x = 17.5 is at 35 ms
    expect(flags).toEqual([{
      index: 8, shotId: 'S1', kind: 'too_slow',
      message: 'apparent velocity 83 m/s between x = 17.5 and 20.0 m is below 100 m/s',
    }]);
  });

  it('a very late pick mid-spread also flags its next neighbour as decreasing (documented: flags say "look here")', () => {
    const flags = strict(withTime(base(), 10, 50));
    expect(flags.map((f) => [f.index, f.kind])).toEqual([[4, 'too_slow'], [5, 'decreasing']]);
  });

  it('decreasing: 18 ms at 12.5 m after 20 ms at 10 m; equal times count too', () => {
    const flags = strict(withTime(base(), 12.5, 18));
    expect(flags).toEqual([{
      index: 5, shotId: 'S1', kind: 'decreasing',
      message: 'time falls by 2.00 ms between x = 10.0 and 12.5 m, moving away from the source at x = 0.0 m',
    }]);
    const equal = strict(withTime(base(), 12.5, 20));
    expect(equal.map((f) => [f.index, f.kind])).toEqual([[5, 'decreasing']]);
    expect(equal[0].message).toContain('time does not increase');
  });

  it('walks away from the source on both sides of a split spread', () => {
    const split = uniformShot('S2', 10, stations(0, 20, 2.5), 500);
    expect(strict(split)).toEqual([]);
    // Left side: x = 2.5 is farther from the source at 10 than x = 5 (10 ms); 9 ms there decreases.
    const flags = strict(withTime(split, 2.5, 9));
    expect(flags.map((f) => [f.index, f.kind])).toEqual([[1, 'decreasing']]);
    expect(flags[0].message).toBe('time falls by 1.00 ms between x = 2.5 and 5.0 m, moving away from the source at x = 10.0 m');
  });

  it('off-end shots (all receivers on one side) are walked from the nearest receiver; the source itself is not a station', () => {
    const beforeStart = uniformShot('L', -5, stations(0, 20, 2.5), 500);
    const afterEnd = uniformShot('R', 25, stations(0, 20, 2.5), 500, 100);
    expect(strict([...beforeStart, ...afterEnd])).toEqual([]);
    // 0.1 ms at 5 m from the source would be 50000 m/s against the source, but no pick sits there.
    expect(strict(withTime(beforeStart, 0, 0.1).filter((p) => p.receiverX <= 2.5))).toEqual([]);
    // Walking leftwards from the source at 25 m: x = 5 at 35 ms after x = 7.5 at 40 ms decreases.
    const flags = strict(withTime(afterEnd, 5, 35));
    expect(flags.map((f) => [f.index, f.shotId, f.kind])).toEqual([[102, 'R', 'decreasing']]);
  });

  it('excluded picks are ignored and the walk bridges them', () => {
    const bad = withTime(base(), 10, 15.25).map((p) => (p.receiverX === 10 ? { ...p, excluded: true } : p));
    expect(strict(bad)).toEqual([]); // 7.5 → 12.5 m: 5 m in 10 ms = 500 m/s
    const badExcludedNeighbour = withTime(base(), 12.5, 18).map((p) => (p.receiverX === 10 ? { ...p, excluded: true } : p));
    // 12.5 m at 18 ms after 7.5 m at 15 ms: 5 m in 3 ms = 1667 m/s, no longer suspect.
    expect(strict(badExcludedNeighbour)).toEqual([]);
  });

  it('two receivers at the same x form one station; the next station is compared with their mean', () => {
    const dup = [...base(), pick(50, 'S1', 0, 10, 20.4)];
    expect(strict(dup)).toEqual([]);
    // One of the pair too early: 15.1 ms at 10 m after 15 ms at 7.5 m = 25000 m/s.
    const oneBad = [...base(), pick(50, 'S1', 0, 10, 15.1)];
    const flags = strict(oneBad);
    expect(flags).toEqual([{ index: 50, shotId: 'S1', kind: 'too_fast', message: 'apparent velocity 25000 m/s between x = 7.5 and 10.0 m exceeds 8000 m/s' }]);
  });

  it('non-finite picks are skipped and never put NaN into a message', () => {
    const picks = [...base(), pick(60, 'S1', 0, 11, NaN), pick(61, 'S1', 0, Infinity, 30), pick(62, 'S1', NaN, 5, 10)];
    expect(strict(picks)).toEqual([]);
    const flags = strict([...withTime(base(), 10, 15.25), pick(60, 'S1', 0, 11, NaN)]);
    expect(flags).toHaveLength(1);
    expect(flags[0].message).not.toMatch(/NaN|Infinity/);
  });

  it('rejects bad thresholds and a shot with two source positions, with a clear message', () => {
    expect(() => flagSuspectPicks(base(), { vMin: -1 })).toThrow(/vMin/);
    expect(() => flagSuspectPicks(base(), { vMin: 500, vMax: 400 })).toThrow(/vMax/);
    expect(() => flagSuspectPicks(base(), { vMax: NaN })).toThrow(/vMax/);
    expect(() => flagSuspectPicks([...base(), pick(70, 'S1', 2.5, 5, 10)])).toThrow(/shot S1: picks disagree on the source position/);
  });

  it('allows for pick uncertainty: flags only what no times within 2·√(σ₁² + σ₂²) can explain', () => {
    // σ = 0.5 ms on every pick → allowance 2·√(0.5² + 0.5²) = 1.41 ms.
    expect(flagSuspectPicks(withTime(base(), 10, 15.25))).toEqual([]); // 0.25 ms step: within the allowance
    expect(flagSuspectPicks(withTime(base(), 12.5, 19))).toEqual([]); // falls 1 ms: within the allowance
    const falls = flagSuspectPicks(withTime(base(), 12.5, 18)); // falls 2 ms after 20 ms at 10 m
    expect(falls.map((f) => [f.index, f.kind])).toEqual([[5, 'decreasing']]);
    const slow = flagSuspectPicks(withTime(base(), 20, 65)); // 2.5 m in 30 ms: even 28.6 ms gives 87 m/s
    expect(slow.map((f) => [f.index, f.kind])).toEqual([[8, 'too_slow']]);
    expect(() => flagSuspectPicks(base(), { sigmaAllowance: -1 })).toThrow(/sigmaAllowance/);
  });
});
