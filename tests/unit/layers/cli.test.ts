/**
 * `npm run layers` end to end (FORMATS.md §3), spawned as a real process, on exact two-layer
 * times (V1 = 500, V2 = 2000 m/s, refractor 10 m deep; Telford, Geldart & Sheriff 1990 §4.3)
 * with 0.3 ms noise: the JSON line, the depth table and the layered model, and the refusals.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel } from '../../../shared/model';
import { planarSurvey } from '../../references/layers/surveys';

const root = fileURLToPath(new URL('../../../', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'timefield-layers-'));
const write = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};
function layers(...args: string[]) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/layers.ts', ...args], { cwd: root, encoding: 'utf8', timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

let model: string, picks: string, oneShot: string, nearOnly: string;

beforeAll(() => {
  const { shots } = planarSurvey(500, 2000, 10, 0, 0.0003, 2);
  const header = 'shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms';
  const rows: string[] = [];
  for (const s of shots) for (let i = 0; i < s.times.length; i++) rows.push(`${s.shotId},${s.source.x},,${s.receivers[2 * i]},,${(s.times[i] * 1000).toFixed(4)},0.3`);
  picks = write('flat.picks.csv', [header, ...rows].join('\n') + '\n');
  oneShot = write('one.picks.csv', [header, ...rows.filter((r) => r.startsWith('S23,'))].join('\n') + '\n');
  // Only offsets under 20 m: every pick is a direct arrival, no curve reaches the refractor.
  nearOnly = write('near.picks.csv', [header, ...rows.filter((r) => Math.abs(Number(r.split(',')[3]) - Number(r.split(',')[1])) < 20)].join('\n') + '\n');
  // The ground is this grid's top row (z = 50 m); velocities are not used.
  model = write('ground.model.json', JSON.stringify({ format: 'timefield-model/1', grid: { x0: -44, dx: 1, nx: 181, z0: 50, dz: 1, nz: 41 }, layers: [{ name: 'any', v_top: 1000, v_base: 1000 }] }));
});

describe('npm run layers', () => {
  it('GRM: the JSON line, a depth table without gaps or NaN, and a layered model through the depths', () => {
    const out = join(dir, 'layers.model.json');
    const depths = join(dir, 'depths.csv');
    const r = layers('--picks', picks, '--model', model, '--json', '--out', out, '--depths', depths);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const line = JSON.parse(r.stdout.trim().split('\n').at(-1)!);
    expect(Object.keys(line)).toEqual(['method', 'geophones', 'xy_m', 'layers', 'depth_m', 'warnings']);
    expect(line.method).toBe('grm');
    expect(line.layers[0].velocity / 500).toBeCloseTo(1, 1);
    expect(Math.abs(line.layers[1].velocity / 2000 - 1)).toBeLessThan(0.05);
    expect(Math.abs(line.depth_m.median / 10 - 1)).toBeLessThan(0.05);
    expect(line.xy_m).toBeGreaterThanOrEqual(0);

    const csv = readFileSync(depths, 'utf8').trim().split('\n');
    expect(csv[0]).toBe('receiver_x,ground_z,refractor,depth_m,refractor_z,refractor_velocity');
    expect(csv.length - 1).toBe(line.geophones);
    for (const row of csv.slice(1)) {
      const cells = row.split(',').map(Number);
      expect(cells.every(Number.isFinite)).toBe(true);
      expect(cells[1]).toBe(50);
      expect(cells[4]).toBeCloseTo(cells[1] - cells[3], 2); // refractor_z = ground_z − depth_m
    }

    const parsed = parseModelFile(JSON.parse(readFileSync(out, 'utf8')));
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    expect(parsed.model.layers!.map((l) => l.v_top)).toEqual(line.layers.map((l: { velocity: number }) => l.velocity));
    // The rasterised model has the refractor where the table says: 10 m down under x = 48.
    const raster = rasteriseModel(parsed.model);
    const ix = 48 + 44;
    const column = Array.from({ length: 41 }, (_, iz) => raster.velocity[iz * 181 + ix]);
    const firstFast = column.findIndex((v) => v > 1000);
    expect(Math.abs(firstFast - 10)).toBeLessThanOrEqual(1);
  }, 60_000);

  it('plus-minus and intercept time give the same ground within 5 %', () => {
    for (const method of ['plus-minus', 'intercept']) {
      const r = layers('--picks', picks, '--model', model, '--method', method, '--json');
      expect(r.code).toBe(0);
      const line = JSON.parse(r.stdout.trim().split('\n').at(-1)!);
      expect(line.xy_m).toBeNull();
      expect(Math.abs(line.layers[1].velocity / 2000 - 1)).toBeLessThan(0.05);
      expect(Math.abs(line.depth_m.median / 10 - 1)).toBeLessThan(0.05);
    }
  }, 60_000);

  it('refuses bad input with a sentence and a non-zero exit', () => {
    const one = layers('--picks', oneShot, '--model', model);
    expect(one.code).toBe(1);
    expect(one.stderr).toMatch(/reversed shots|two shots/);
    const near = layers('--picks', nearOnly, '--model', model);
    expect(near.code).toBe(1);
    expect(near.stderr).toMatch(/no travel-time curve reaches refractor 1/);
    const wide = layers('--picks', picks, '--model', model, '--xy', '500');
    expect(wide.code).toBe(1);
    expect(wide.stderr).toMatch(/XY 500 m must be from 0 to the spread's length \(94 m\)/);
    const method = layers('--picks', picks, '--model', model, '--method', 'delay');
    expect(method.code).toBe(2);
    expect(method.stderr).toMatch(/--method must be grm, plus-minus or intercept/);
    const small = write('small.model.json', JSON.stringify({ format: 'timefield-model/1', grid: { x0: 0, dx: 1, nx: 41, z0: 50, dz: 1, nz: 41 }, layers: [{ name: 'any', v_top: 1000, v_base: 1000 }] }));
    const outside = layers('--picks', picks, '--model', small);
    expect(outside.code).toBe(1);
    expect(outside.stderr).toMatch(/outside the model/);
  }, 60_000);

  it('takes a hand assignment from a file, and refuses a bad one whole with line and column', () => {
    // Leave every pick of the shot at 23 m out: the answer still comes from the other shots.
    const good = write('hand.csv', ['shot_id,receiver_x,layer', ...Array.from({ length: 48 }, (_, i) => 2 * i).filter((x) => x !== 23).map((x) => `S23,${x},-1`)].join('\n') + '\n');
    const ok = layers('--picks', picks, '--model', model, '--assignment', good, '--json');
    expect(ok.code).toBe(0);
    expect(Math.abs(JSON.parse(ok.stdout.trim().split('\n').at(-1)!).depth_m.median / 10 - 1)).toBeLessThan(0.05);
    const bad = write('bad-hand.csv', 'shot_id,receiver_x,layer\nNOPE,2,1\nS23,abc,1\nS23,2,7\n');
    const r = layers('--picks', picks, '--model', model, '--assignment', bad);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/line 2, shot_id: no shot "NOPE"/);
    expect(r.stderr).toMatch(/line 3, receiver_x: "abc" is not a number/);
    expect(r.stderr).toMatch(/line 4, layer: must be a whole number from -1 to 1/);
  }, 60_000);
});
