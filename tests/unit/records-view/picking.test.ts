/**
 * Picking on records: the undo history, the rows saved as a pick set (checked with the pick-file
 * rules of FORMATS.md §2 through the project's pick-set schema, not by the code that built them),
 * and snapping to the onset of a causal wavelet whose first sample is the exact arrival time.
 */
import { describe, expect, it } from 'vitest';
import { pickSetSchema } from '../../../shared/schemas/picks';
import type { RecordSummaryView, RecordTraceView } from '../../../shared/schemas/records';
import { bandLimitedNoise, normals, wavelet } from '../../../shared/records/synthetic-trace';
import { emptyPicking, pickCount, pickingReducer, type PickingAction, type PickingState } from '../../../src/components/records/pickingState';
import { pickRows } from '../../../src/components/records/pickRows';
import { snapToOnset } from '../../../src/lib/traces/snap';

const run = (actions: PickingAction[], from: PickingState = emptyPicking) => actions.reduce(pickingReducer, from);
const hand = (timeMs: number) => ({ timeMs, sigmaMs: 0.5, how: 'hand' as const });

describe('picking state', () => {
  it('sets, replaces and undoes step by step, counting unsaved changes', () => {
    const s = run([
      { kind: 'set', recordId: 'r1', traces: 4, trace: 1, mark: hand(10) },
      { kind: 'set', recordId: 'r1', traces: 4, trace: 2, mark: hand(12) },
      { kind: 'replace', recordId: 'r2', marks: [hand(5), null] },
    ]);
    expect(pickCount(s.byRecord.r1)).toBe(2);
    expect(s.unsaved).toBe(3);
    const u1 = run([{ kind: 'undo' }], s);
    expect(u1.byRecord.r2).toBeUndefined();
    const u2 = run([{ kind: 'undo' }], u1);
    expect(u2.byRecord.r1).toEqual([null, hand(10), null, null]);
    expect(u2.unsaved).toBe(1);
  });

  it('takes automatic picks arriving from the picker worker without overwriting hand picks made before or meanwhile', () => {
    const auto = (timeMs: number) => ({ timeMs, sigmaMs: 0.4, how: 'auto' as const });
    const s = run([
      { kind: 'set', recordId: 'r1', traces: 3, trace: 1, mark: hand(10) },
      { kind: 'auto', recordId: 'r1', marks: [auto(8), auto(11), null] },
    ]);
    expect(s.byRecord.r1).toEqual([auto(8), hand(10), null]);
    expect(run([{ kind: 'undo' }], s).byRecord.r1).toEqual([null, hand(10), null]);
  });

  it('does not record a change that changes nothing, and a save clears the unsaved count but keeps undo', () => {
    const s = run([
      { kind: 'set', recordId: 'r1', traces: 2, trace: 0, mark: hand(3) },
      { kind: 'set', recordId: 'r1', traces: 2, trace: 0, mark: hand(3) },
      { kind: 'saved' },
    ]);
    expect(s.history).toHaveLength(1);
    expect(s.unsaved).toBe(0);
  });
});

const summary = (id: string, shotId: string, source: RecordSummaryView['source']): RecordSummaryView => ({
  id, lineId: 'l', fileName: `${shotId}.sg2`, format: 'seg2', revision: '1', bytes: 1, sha256: '', channels: 3, sampleIntervalMs: 0.25, samplesPerTrace: 100,
  recordLengthMs: 25, delayMs: 0, acquired: null, shotId, source, sourceFrom: source ? 'header' : 'none', receiversFrom: 'header', uploadedBy: '', uploadedAt: '', pickSetIds: [],
});
const traces = (xs: (number | null)[]): RecordTraceView[] =>
  xs.map((x, index) => ({ index, channel: index + 1, receiver: x === null ? null : { x, z: null }, sampleIntervalMs: 0.25, samples: 100, delayMs: 0, stack: null, markedDead: false }));

describe('pick rows for saving', () => {
  it('carries the shot and receiver positions and passes the pick-file rules', () => {
    const out = pickRows([{ summary: summary('a', 'S1', { x: -5, z: null }), traces: traces([0, 2.5, null]), marks: [hand(8.5), hand(11), hand(14)] }]);
    expect(out.problems).toEqual([]);
    expect(out.unplaced).toBe(1);
    expect(out.recordIds).toEqual(['a']);
    expect(out.rows).toEqual([
      { shot_id: 'S1', source_x: -5, source_z: null, receiver_x: 0, receiver_z: null, time_ms: 8.5, sigma_ms: 0.5 },
      { shot_id: 'S1', source_x: -5, source_z: null, receiver_x: 2.5, receiver_z: null, time_ms: 11, sigma_ms: 0.5 },
    ]);
    expect(pickSetSchema.safeParse(out.rows).success).toBe(true);
  });

  it('refuses a record without a shot position and two records with one shot id, and skips unpicked records', () => {
    const out = pickRows([
      { summary: summary('a', 'S1', null), traces: traces([0]), marks: [hand(3)] },
      { summary: summary('b', 'S2', { x: 0, z: null }), traces: traces([5]), marks: [hand(3)] },
      { summary: summary('c', 'S2', { x: 10, z: null }), traces: traces([5]), marks: [hand(4)] },
      { summary: summary('d', 'S9', { x: 10, z: null }), traces: traces([5]), marks: [null] },
    ]);
    expect(out.problems).toHaveLength(2);
    expect(out.problems[0]).toMatch(/S1\.sg2 .*no shot position/);
    expect(out.problems[1]).toMatch(/both carry shot id S2/);
    expect(out.recordIds).not.toContain('d');
  });
});

describe('snap to the onset', () => {
  it('moves a pick 3 ms off to within one sample of the true onset of a causal wavelet in noise (SNR 20)', () => {
    const dt = 0.00025, n = 800, onset = 0.05;
    const noise = bandLimitedNoise(n, dt, normals(7));
    const samples = Float64Array.from({ length: n }, (_, i) => wavelet(i * dt - onset) / 0.6 + noise[i] / 20);
    const trace = { samples, sampleInterval: dt, delay: 0 };
    for (const off of [-3, 3]) expect(Math.abs(snapToOnset(trace, onset * 1000 + off) - onset * 1000)).toBeLessThanOrEqual(0.25);
  });
});
