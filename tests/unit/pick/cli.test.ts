/**
 * `npm run pick` end to end (FORMATS.md §3), spawned as a real process, on records written by our
 * SEG-2 and SEG-Y writers from a synthetic gather (engine travel times, SNR 20; scripts/bench/
 * synthetic-gathers.ts). The pick file is checked with the project's pick-file parser (FORMATS.md §2).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { parsePickText } from '../../../shared/picks';
import { writeSeg2, writeSegy } from '../../../shared/records';
import { SAMPLE_INTERVAL, surveyTimes, syntheticGathers } from '../../../scripts/bench/synthetic-gathers';

const root = fileURLToPath(new URL('../../../', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'timefield-pick-'));
function pick(...args: string[]) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/pick.ts', ...args], { cwd: root, encoding: 'utf8', timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

const DELAY = -0.002; // a 2 ms pre-trigger: the samples are shifted so the truth stays the same after the shot
const shift = Math.round(-DELAY / SAMPLE_INTERVAL);
let seg2: string, segy: string, bare: string, bad: string, stations: string;
let truth: Map<number, number | null>;

beforeAll(() => {
  const gather = syntheticGathers(20)[1];
  const shot = surveyTimes()[1];
  truth = new Map(gather.map((t, k) => [shot.receivers[k], t.truth]));
  const delayed = gather.map((t) => Float64Array.from({ length: t.samples.length }, (_, i) => (i < shift ? t.samples[0] : t.samples[i - shift])));
  const traces = delayed.map((samples, k) => ({
    samples: Array.from(samples, (v) => Math.round(v * 1e5)),
    channel: k + 1,
    sampleInterval: SAMPLE_INTERVAL,
    delay: DELAY,
    descale: 1e-5,
    receiver: { x: shot.receivers[k], y: null, z: null },
    source: { x: shot.shot, y: null, z: null },
  }));
  seg2 = join(dir, 'S0.sg2');
  writeFileSync(seg2, writeSeg2(traces, { format: 2, keywords: [['NOTE', 'invented test line']] }));
  segy = join(dir, 'S0b.sgy');
  writeFileSync(segy, writeSegy(traces.map((t) => ({ ...t, samples: t.samples.map((v) => v * 1e-5) })), { sampleInterval: SAMPLE_INTERVAL }));
  bare = join(dir, 'nopos.sg2');
  writeFileSync(bare, writeSeg2(traces.slice(0, 3).map((t) => ({ ...t, receiver: null, source: null }))));
  bad = join(dir, 'cut.sg2');
  writeFileSync(bad, readFileSync(seg2).subarray(0, 500));
  stations = join(dir, 'stations.csv');
  writeFileSync(stations, `station,x,z\n${traces.map((t) => `${t.channel},${t.receiver.x + 1000},${50 + t.channel / 10}`).join('\n')}\n`);
});

describe('npm run pick', () => {
  it('picks a SEG-2 and a SEG-Y record: a valid pick file, the JSON line, dead traces unpicked', () => {
    const out = join(dir, 'out.picks.csv');
    const r = pick('--records', seg2, segy, '--out', out, '--json');
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const summary = JSON.parse(r.stdout.trim().split('\n').pop()!);
    expect(Object.keys(summary)).toEqual(['records', 'traces', 'picked', 'unpicked', 'seconds']);
    expect(summary.records).toBe(2);
    expect(summary.traces).toBe(2 * truth.size);
    expect(summary.picked + summary.unpicked).toBe(summary.traces);
    const parsed = parsePickText(readFileSync(out, 'utf8'));
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    expect(parsed.picks).toHaveLength(summary.picked);
    expect(new Set(parsed.picks.map((p) => p.shotId))).toEqual(new Set(['S0', 'S0b']));
    const dead = [...truth.values()].filter((t) => t === null).length;
    expect(summary.unpicked).toBeGreaterThanOrEqual(2 * dead);
    for (const p of parsed.picks) {
      const want = truth.get(p.receiverX);
      expect(want).not.toBeNull(); // no dead trace picked
      expect(p.sourceX).toBe(0);
    }
    // With the 2 ms delay applied, most picks sit within 1 ms of the engine's time.
    const close = parsed.picks.filter((p) => Math.abs(p.time - truth.get(p.receiverX)!) <= 0.001).length;
    expect(close / parsed.picks.length).toBeGreaterThan(0.9);
  });

  it('writes the traces as read with --traces: delay applied, stored × DESCALING_FACTOR', () => {
    const traces = join(dir, 'traces');
    const r = pick('--records', seg2, '--traces', traces, '--out', join(dir, 'x.csv'));
    expect(r.code).toBe(0);
    const lines = readFileSync(join(traces, 'S0.sg2.csv'), 'utf8').trim().split('\n');
    expect(lines[0]).toBe(['time_ms', ...Array.from({ length: truth.size }, (_, k) => k + 1)].join(','));
    expect(lines).toHaveLength(1 + 800);
    const row = lines[1 + shift + 100].split(',').map(Number);
    expect(row[0]).toBeCloseTo(100 * SAMPLE_INTERVAL * 1000, 9);
    const stored = Math.round(syntheticGathers(20)[1][0].samples[100] * 1e5);
    expect(row[1]).toBeCloseTo(stored * 1e-5, 12);
    expect(Number(lines[1].split(',')[0])).toBeCloseTo(-2, 9);
  });

  it('a record without positions still has its traces written; they count as unpicked, exit 0', () => {
    const traces = join(dir, 'bare');
    const r = pick('--records', bare, '--json', '--traces', traces);
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/nopos\.sg2: 3 of 3 traces have no source or receiver position/);
    expect(JSON.parse(r.stdout.trim().split('\n').pop()!)).toMatchObject({ records: 1, traces: 3, picked: 0, unpicked: 3 });
    expect(existsSync(join(traces, 'nopos.sg2.csv'))).toBe(true);
  });

  it('--stations overrides receiver positions by channel', () => {
    const r = pick('--records', seg2, '--stations', stations);
    expect(r.code).toBe(0);
    const parsed = parsePickText(r.stdout);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    for (const p of parsed.picks) {
      expect(p.receiverX).toBeGreaterThanOrEqual(1000);
      expect(p.receiverZ).toBeCloseTo(50 + (p.receiverX - 1000) / 20, 6); // channel k+1 sits at x = 2k
    }
  });

  it('refuses a truncated record (exit 1) with the byte offset, and writes nothing', () => {
    const out = join(dir, 'never.csv');
    const r = pick('--records', seg2, bad, '--out', out);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/cut\.sg2: byte \d+: /);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    expect(existsSync(out)).toBe(false);
  });

  it('quotes a shot id taken from a file name with a comma or a quote', () => {
    const odd = join(dir, 'shot "A",1.sg2');
    writeFileSync(odd, readFileSync(seg2));
    const r = pick('--records', odd);
    expect(r.code).toBe(0);
    const parsed = parsePickText(r.stdout);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
    expect(new Set(parsed.picks.map((p) => p.shotId))).toEqual(new Set(['shot "A",1']));
  });

  it('usage errors exit 2', () => {
    expect(pick().code).toBe(2);
    expect(pick('--records', seg2, '--bogus').code).toBe(2);
  });
});
