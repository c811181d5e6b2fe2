/**
 * `npm run invert` end to end (FORMATS.md §3), spawned as a real process. The picks are a
 * two-layer survey computed on a grid four times finer than the inversion's with 0.5 ms noise
 * (tests/references/inversion/surveys.ts), so χ² ≤ 1.2 is reachable (issue 11 target).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { parseModelFile } from '../../../shared/model';
import { layeredModel, layeredSurvey } from '../../references/inversion/surveys';

const root = fileURLToPath(new URL('../../../', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'timefield-invert-'));
const write = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};
function invert(...args: string[]) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/invert.ts', ...args], { cwd: root, encoding: 'utf8', timeout: 170_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

let model: string;
let picks: string;
let oneShot: string;
const grid = { x0: -8, dx: 1, nx: 113, z0: 100, dz: 1, nz: 26 };

beforeAll(() => {
  const shots = layeredSurvey(layeredModel([600, 2500], [8], 40), 0.0005, 11);
  const rows = ['# two layers, 600 over 2500 m/s, interface 8 m deep; times from a 0.25 m grid + 0.5 ms noise', 'shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms'];
  for (const s of shots) {
    for (let i = 0; i < s.times.length; i++) rows.push(`${s.shotId},${s.source.x},,${s.receivers[2 * i]},,${(s.times[i] * 1000).toFixed(4)},0.5`);
  }
  picks = write('two-layer.picks.csv', `${rows.join('\n')}\n`);
  oneShot = write('one-shot.picks.csv', `${rows.filter((r, i) => i < 2 || r.startsWith('S0,')).join('\n')}\n`);
  // Empty elevations put shots and geophones on this grid's ground (its top row, 100 m).
  model = write('start.model.json', JSON.stringify({ format: 'timefield-model/1', grid, layers: [{ name: 'uniform', v_top: 1000, v_base: 1000 }] }));
});

describe('npm run invert', () => {
  it('inverts from the automatic gradient to χ² ≤ 1.2 and writes the JSON line, model and residuals', () => {
    const out = join(dir, 'result.model.json');
    const residuals = join(dir, 'residuals.csv');
    const r = invert('--model', model, '--picks', picks, '--start', 'gradient', '--json', '--out', out, '--residuals', residuals, '--threads', '2');
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const summary = JSON.parse(r.stdout.trim().split('\n').pop()!);
    expect(Object.keys(summary)).toEqual(expect.arrayContaining(['picks', 'shots', 'iterations', 'chi2', 'rms_ms', 'chi2_history', 'rms_ms_history', 'seconds']));
    expect(summary.shots).toBe(11);
    expect(summary.picks).toBe(11 * 49 - 9); // nine shots sit on a geophone and have no pick there
    expect(summary.chi2).toBeLessThanOrEqual(1.2);
    expect(summary.chi2_history).toHaveLength(summary.iterations + 1);
    expect(summary.chi2_history.at(-1)).toBe(summary.chi2);
    expect(summary.rms_ms).toBeGreaterThan(0.3);
    expect(summary.rms_ms).toBeLessThan(0.7);

    const written = JSON.parse(readFileSync(out, 'utf8'));
    const parsed = parseModelFile(written);
    expect(parsed.ok).toBe(true);
    expect(written.velocity).toHaveLength(grid.nx * grid.nz);
    expect(written.coverage).toHaveLength(grid.nx * grid.nz);
    expect(written.doi).toHaveLength(grid.nx);
    const lines = readFileSync(residuals, 'utf8').trim().split('\n');
    expect(lines[0]).toBe('shot_id,receiver_x,receiver_z,observed_ms,computed_ms,residual_ms');
    expect(lines).toHaveLength(summary.picks + 1);
  }, 180_000);

  it('refuses reversed velocity bounds as a usage error (exit 2) naming the option', () => {
    const r = invert('--model', model, '--picks', picks, '--vmin', '3000', '--vmax', '2000');
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--vmax: must be greater than vMin');
  });

  it('refuses picks from a single shot (exit 1) with a sentence', () => {
    const r = invert('--model', model, '--picks', oneShot);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain('at least two shots');
  });

  it('refuses a missing file (exit 1) without a stack trace', () => {
    const r = invert('--model', join(dir, 'missing.json'), '--picks', picks);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/cannot read the model file \(ENOENT\)/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });
});
