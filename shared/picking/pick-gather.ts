import { alignToNeighbours } from './align';
import { stackedArrivals } from './local-stack';
import { firstBreak, pickBefore, pickInWindow, traceCandidates, windowsOf, type PickerOptions, type PickOutcome, type TraceCandidates } from './pick-trace';

export interface GatherTrace {
  samples: Float64Array;
  /** Seconds. */
  sampleInterval: number;
  /** Seconds (negative: pre-trigger). */
  delay: number;
}

/** A pick further than this from the trend of its neighbours is looked for again near the trend (s). */
const OUTLIER = 0.002;
/** Half-width of the window searched around the trend (s). */
const WINDOW = 0.003;
/** Neighbours each side (in offset) that make the trend. */
const NEIGHBOURS = 3;

/**
 * Picks a shot gather: every trace on its own first (pickTrace); then, for one record's traces with
 * positions, again where the slant stack with its neighbours first shows an arrival (local-stack.ts);
 * then a consistency pass along the spread — on each side of the shot, each pick is compared with the
 * straight-line trend (Theil–Sen: the median of pairwise slopes; Sen 1968) of its nearest picked
 * neighbours in offset, and a pick far from it (a later, stronger arrival or a burst of noise) is
 * looked for again in a window around the trend (first arrivals change slope only gently from
 * geophone to geophone, so a local line is a safe guide; common practice, no source); last, each
 * pick is aligned with its neighbours' waveforms and its onset read on their sum (align.ts).
 * `positions`: each receiver's position along the line minus the shot's (m), null where unknown;
 * without positions the traces are picked on their own. docs/records.md has the measured accuracy.
 */
export function pickGather(traces: GatherTrace[], positions: (number | null)[] | null, options: PickerOptions = {}): PickOutcome[] {
  // Each trace demeaned and its candidates found once, for every pass below.
  const prepared = traces.map((t) => traceCandidates(t.samples, t.sampleInterval, t.delay, options));
  const outcomes = prepared.map((p): PickOutcome => (p === 'dead' ? { ok: false, reason: 'dead' } : firstBreak(p, options)));
  if (!positions) return outcomes;
  const shared = oneRecord(traces);
  if (shared) stackedPass(traces, prepared, positions, outcomes, options);
  for (const side of [-1, 1]) {
    const members = traces.map((_, i) => i).filter((i) => positions[i] !== null && Math.sign(positions[i]!) === side);
    members.sort((a, b) => Math.abs(positions[a]!) - Math.abs(positions[b]!));
    for (let pass = 0; pass < 2; pass++) {
      const changes: [number, PickOutcome][] = [];
      members.forEach((i, k) => {
        const current = outcomes[i];
        if (current.ok === false && current.reason === 'dead') return;
        const trend = trendAt(members, k, positions, outcomes);
        if (trend === null) return;
        const off = current.ok ? current.pick.time - trend : Infinity;
        if (Math.abs(off) <= OUTLIER) return;
        const t = traces[i];
        const again = pickInWindow(t.samples, t.sampleInterval, t.delay, trend - WINDOW, trend + WINDOW, options);
        if (again.ok && Math.abs(again.pick.time - trend) < Math.abs(off)) changes.push([i, again]);
      });
      for (const [i, o] of changes) outcomes[i] = o;
      if (!changes.length) break;
    }
  }
  if (shared) alignPass(traces, prepared, positions, outcomes);
  return outcomes;
}

/** Whether the traces share one sample interval and delay (one record), as the stacked passes need. */
function oneRecord(traces: GatherTrace[]): boolean {
  return traces.length >= 3 && traces.every((t) => t.sampleInterval === traces[0].sampleInterval && t.delay === traces[0].delay);
}

/** Pilot windows for the alignment (s): noise before the onset, the first cycles after it, the largest shift. */
const ALIGN = { before: 0.002, after: 0.006, maxLag: 0.002 };

/** Each side's picks aligned to their neighbours' waveforms (align.ts); quality and sigma kept. */
function alignPass(traces: GatherTrace[], prepared: (TraceCandidates | 'dead')[], positions: (number | null)[], outcomes: PickOutcome[]): void {
  const { sampleInterval: dt, delay } = traces[0];
  const x = prepared.map((p, i) => (outcomes[i].ok && p !== 'dead' ? p.x : null));
  const w = { before: Math.round(ALIGN.before / dt), after: Math.round(ALIGN.after / dt), maxLag: Math.round(ALIGN.maxLag / dt) };
  for (const side of [-1, 1]) {
    const members = traces.map((_, i) => i).filter((i) => positions[i] !== null && Math.sign(positions[i]!) === side);
    members.sort((a, b) => Math.abs(positions[a]!) - Math.abs(positions[b]!));
    // Sample position of each onset (its first signal sample), as the picker's index.
    const at = traces.map((_, i) => { const o = outcomes[i]; return o.ok ? (o.pick.time - delay) / dt + 0.5 : null; });
    const refined = alignToNeighbours(x, at, members, w);
    for (const i of members) {
      const o = outcomes[i];
      const p = refined[i];
      if (!o.ok || p === null || p === at[i]) continue;
      outcomes[i] = { ok: true, pick: { ...o.pick, time: delay + (p - 0.5) * dt, index: Math.round(p) } };
    }
  }
}

/** The time the neighbours' trend predicts at member k (s), or null with fewer than three picked neighbours. */
function trendAt(members: number[], k: number, positions: (number | null)[], outcomes: PickOutcome[]): number | null {
  const pts: [number, number][] = [];
  for (const dir of [-1, 1]) {
    let taken = 0;
    for (let j = k + dir; j >= 0 && j < members.length && taken < NEIGHBOURS; j += dir) {
      const o = outcomes[members[j]];
      if (!o.ok) continue;
      pts.push([Math.abs(positions[members[j]]!), o.pick.time]);
      taken++;
    }
  }
  if (pts.length < 3) return null;
  const slopes: number[] = [];
  for (let a = 0; a < pts.length; a++) for (let b = a + 1; b < pts.length; b++) if (pts[b][0] !== pts[a][0]) slopes.push((pts[b][1] - pts[a][1]) / (pts[b][0] - pts[a][0]));
  if (!slopes.length) return null;
  const slope = median(slopes);
  const intercept = median(pts.map(([x, t]) => t - slope * x));
  return intercept + slope * Math.abs(positions[members[k]]!);
}

function median(v: number[]): number {
  const s = [...v].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/**
 * Each trace picked again where the slant stack with its neighbours (local-stack.ts) first shows an
 * arrival, when the traces share one sample interval and delay (one record); the trace's own pick
 * stays where the stack finds nothing.
 */
function stackedPass(traces: GatherTrace[], prepared: (TraceCandidates | 'dead')[], positions: (number | null)[], outcomes: PickOutcome[], options: PickerOptions): void {
  const { sampleInterval: dt, delay } = traces[0];
  const live = prepared.map((p) => (p === 'dead' ? null : p));
  const stackTraces = live.map((p, i) => ({ x: p?.x ?? null, offset: positions[i] === null ? null : Math.abs(positions[i]!) }));
  const { short, long } = windowsOf(dt, options);
  const from = Math.max(0, Math.ceil(-delay / dt)) + 4;
  for (const side of [-1, 1]) {
    const members = traces.map((_, i) => i).filter((i) => positions[i] !== null && Math.sign(positions[i]!) === side);
    const peaks = stackedArrivals(stackTraces, members, dt, short, long, from);
    members.forEach((i) => {
      const peak = peaks[i];
      if (peak !== null && live[i]) outcomes[i] = pickBefore(live[i] as TraceCandidates, peak, options);
    });
  }
}
