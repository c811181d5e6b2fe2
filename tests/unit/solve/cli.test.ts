/**
 * `npm run solve` end to end (FORMATS.md §3), spawned as a real process on small files.
 * Reference: in a homogeneous medium the first-arrival time is the straight-ray time
 * T = r / v (common practice, no source). Picks are generated here from that formula;
 * one shot is shifted by a known 2 ms so residuals and statistics have non-trivial values.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../../../', import.meta.url));
const fixture = (p: string) => join(root, 'fixtures', p);
const dir = mkdtempSync(join(tmpdir(), 'timefield-solve-'));

function solve(...args: string[]) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/solve.ts', ...args], { cwd: root, encoding: 'utf8', timeout: 110_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}
const write = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};

// homogeneous.model.json: 1000 m/s, x 0..40 m, z 0..−10 m, no surface → ground at z = 0.
const V = 1000;
const SHIFT_MS = 2;
const SIGMA_MS = 0.5;
const shots = [
  { id: 'S1', x: 0, z: null as number | null },
  { id: 'S2', x: 20, z: -3 },
  { id: 'S3', x: 40, z: null, shift: SHIFT_MS },
];
interface Row { shot: string; rx: number; rz: number | null; tMs: number }
const rows: Row[] = [];
for (const s of shots) {
  for (let k = 1; k <= 20; k++) {
    const rx = 2 * k;
    if (rx === s.x && s.z === null) continue; // no zero-offset pick needed
    const rz = s.id === 'S2' && k % 5 === 0 ? -6 : null; // a few buried receivers
    const r = Math.hypot(rx - s.x, (rz ?? 0) - (s.z ?? 0));
    rows.push({ shot: s.id, rx, rz, tMs: (r / V) * 1000 + (s.shift ?? 0) });
  }
}
const picksCsv = [
  '# generated in the test: T = r / v',
  'shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms',
  ...rows.map((r) => {
    const s = shots.find((x) => x.id === r.shot)!;
    return `${r.shot},${s.x},${s.z ?? ''},${r.rx},${r.rz ?? ''},${r.tMs.toFixed(6)},${SIGMA_MS}`;
  }),
].join('\n');

// Each spawn starts tsx and (for solves) two worker threads: seconds on a busy machine.
const SPAWN = { timeout: 120_000 };

describe('npm run solve on a homogeneous model', SPAWN, () => {
  let picksPath: string;
  let residualPath: string;
  let out: ReturnType<typeof solve>;

  beforeAll(() => {
    picksPath = write('homog.picks.csv', picksCsv);
    residualPath = join(dir, 'res.csv');
    out = solve('--model', fixture('models/homogeneous.model.json'), '--picks', picksPath, '--json', '--residuals', residualPath, '--threads', '2');
  }, SPAWN.timeout);

  it('exits 0 and ends stdout with one JSON object holding exactly the contract keys', () => {
    expect(out.stderr).toBe('');
    expect(out.code).toBe(0);
    const last = out.stdout.trimEnd().split('\n').at(-1)!;
    const j = JSON.parse(last);
    expect(Object.keys(j).sort()).toEqual(
      ['chi2', 'max_abs_residual_ms', 'nodes', 'nodes_per_second', 'order', 'picks', 'rms_ms', 'shots', 'solve_seconds'].sort(),
    );
    expect(j).toMatchObject({ shots: 3, picks: rows.length, nodes: 81 * 21, order: 2 });
    expect(j.solve_seconds).toBeGreaterThan(0);
    expect(j.nodes_per_second).toBeCloseTo((81 * 21 * 3) / j.solve_seconds, -2);
  });

  it('misfit numbers follow from the 2 ms shift of shot S3 alone', () => {
    const j = JSON.parse(out.stdout.trimEnd().split('\n').at(-1)!);
    const n3 = rows.filter((r) => r.shot === 'S3').length;
    const n = rows.length;
    // residual = +2 ms on S3 picks, ≈ 0 elsewhere: RMS = 2·sqrt(n3/n); χ²/N = (2/0.5)²·n3/n; max = 2
    const tol = 0.02; // ms, allowance for the solver's discretisation error
    expect(j.rms_ms).toBeCloseTo(SHIFT_MS * Math.sqrt(n3 / n), 1);
    expect(Math.abs(j.max_abs_residual_ms - SHIFT_MS)).toBeLessThan(tol);
    expect(j.chi2).toBeCloseTo((SHIFT_MS / SIGMA_MS) ** 2 * (n3 / n), 1);
  });

  it('writes the residual CSV: exact header, one row per pick, receiver_z as used, computed ≈ r/v', () => {
    const lines = readFileSync(residualPath, 'utf8').trimEnd().split('\n');
    expect(lines[0]).toBe('shot_id,receiver_x,receiver_z,observed_ms,computed_ms,residual_ms');
    expect(lines).toHaveLength(rows.length + 1);
    lines.slice(1).forEach((line, i) => {
      const [shot, rx, rz, obs, comp, res] = line.split(',');
      const row = rows[i];
      const s = shots.find((x) => x.id === row.shot)!;
      expect(shot).toBe(row.shot);
      expect(Number(rx)).toBe(row.rx);
      expect(Number(rz)).toBe(row.rz ?? 0); // empty z → the surface, here z0 = 0
      expect(Number(obs)).toBeCloseTo(row.tMs, 3);
      const exact = (Math.hypot(row.rx - s.x, (row.rz ?? 0) - (s.z ?? 0)) / V) * 1000;
      expect(Math.abs(Number(comp) - exact)).toBeLessThan(0.02);
      expect(Number(res)).toBeCloseTo(Number(obs) - Number(comp), 3);
    });
  });

  it('first order runs too and says so', () => {
    const r = solve('--model', fixture('models/homogeneous.model.json'), '--picks', picksPath, '--json', '--order', '1', '--threads', '1');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout.trimEnd().split('\n').at(-1)!).order).toBe(1);
  });

  it('without --json prints a readable summary with the cautions', () => {
    const r = solve('--model', fixture('models/homogeneous.model.json'), '--picks', picksPath, '--threads', '1');
    expect(r.code).toBe(0);
    const n3 = rows.filter((x) => x.shot === 'S3').length;
    expect(r.stdout).toContain(`${rows.length} picks in 3 shots`);
    expect(r.stdout).toMatch(new RegExp(`^S3 +${n3} +2\\.000 +2\\.000 +2\\.000 +16\\.000$`, 'm')); // RMS, mean, max 2 ms; χ² (2/0.5)² = 16
    expect(r.stdout).toMatch(/qualified professional/);
  });
});

describe('npm run solve: bad input', SPAWN, () => {
  const good = ['--model', fixture('models/two-layer.model.json'), '--picks', fixture('picks/line-a.picks.csv')];
  const expectFailure = (r: ReturnType<typeof solve>, code: number, pattern: RegExp) => {
    expect(r.code).toBe(code);
    expect(r.stderr).toMatch(pattern);
    expect(r.stderr).not.toMatch(/^\s+at /m); // no stack trace
    expect(r.stdout).toBe('');
  };

  it('model with a geometry error → exit 1 naming the JSON path', () => {
    expectFailure(
      solve('--model', fixture('models/bad/base-x-not-increasing.model.json'), '--picks', fixture('picks/line-a.picks.csv')),
      1,
      /layers\[1\]\.base\[3\]: x must increase/,
    );
  });

  it('model that is not JSON, or missing → exit 1', () => {
    expectFailure(solve('--model', fixture('models/bad/truncated.model.json'), '--picks', fixture('picks/line-a.picks.csv')), 1, /not valid JSON/);
    expectFailure(solve('--model', join(dir, 'nope.model.json'), '--picks', fixture('picks/line-a.picks.csv')), 1, /cannot read the model file \(ENOENT\)/);
  });

  it('pick file errors → exit 1 naming line and column', () => {
    expectFailure(solve('--model', good[1], '--picks', fixture('picks/non-numeric.picks.csv')), 1, /line 5, time_ms: "abc" is not a number/);
    expectFailure(solve('--model', good[1], '--picks', fixture('picks/empty.picks.csv')), 1, /the file is empty/);
  });

  it('source outside the grid → exit 1 naming the line', () => {
    const p = write('outside.picks.csv', 'shot_id,source_x,receiver_x,time_ms\nS1,10,20,5\nS2,500,20,5\n');
    expectFailure(solve('--model', good[1], '--picks', p), 1, /line 3, source_x: source at x 500 m, z 50 m is outside the model/);
  });

  it('source or receiver in the air → exit 1 naming the line', () => {
    const p = write('air.picks.csv', 'shot_id,source_x,source_z,receiver_x,receiver_z,time_ms\nS1,40,61.5,20,,5\nS2,40,,20,61,5\n');
    expectFailure(solve('--model', fixture('models/three-layer.model.json'), '--picks', p), 1, /line 2, source_z: source at x 40 m, z 61.5 m is in the air/);
    expectFailure(solve('--model', fixture('models/three-layer.model.json'), '--picks', p), 1, /line 3, receiver_z: receiver at x 20 m, z 61 m is in the air/);
  });

  it.each([
    [[], /--model is required/],
    [['--model', 'm.json'], /--picks is required/],
    [[...good, '--order', '3'], /--order must be 1 or 2/],
    [[...good, '--threads', '0'], /--threads must be a whole number/],
    [[...good, '--frobnicate'], /Unknown option '--frobnicate'/],
  ])('usage error %j → exit 2', (args, pattern) => {
    const r = solve(...(args as string[]));
    expectFailure(r, 2, pattern);
    expect(r.stderr).toMatch(/usage: npm run solve/);
  });
});
