/**
 * `npm run bench:picker [-- --json]`: the first-break picker's accuracy (pickGather, as the product
 * picks) on synthetic gathers
 * (scripts/bench/synthetic-gathers.ts) at SNR 3, 5, 10, 20: median and 95th-percentile |error|
 * against the true onset, picks and unpicked traces, dead traces picked (should be 0).
 */
import { pickGather } from '../shared/picking';
import { SAMPLE_INTERVAL, surveyTimes, syntheticGathers } from './bench/synthetic-gathers';

export interface PickerAccuracy {
  snr: number;
  traces: number;
  picked: number;
  unpicked: number;
  dead_picked: number;
  median_abs_error_ms: number;
  p95_abs_error_ms: number;
}

const quantile = (sorted: number[], p: number): number => sorted[Math.min(sorted.length - 1, Math.ceil(p * sorted.length) - 1)];

const SEED = Number(process.env.PICKER_SEED ?? 1);
export function measurePicker(snr: number, seed = SEED): PickerAccuracy {
  const errors: number[] = [];
  let traces = 0, unpicked = 0, deadPicked = 0;
  const shots = surveyTimes();
  syntheticGathers(snr, seed).forEach((gather, s) => {
    // As the product picks: the whole gather, with each receiver's position relative to the shot.
    const picks = pickGather(gather.map((t) => ({ samples: t.samples, sampleInterval: SAMPLE_INTERVAL, delay: 0 })), shots[s].receivers.map((x) => x - shots[s].shot));
    gather.forEach((trace, k) => {
      traces++;
      const r = picks[k];
      if (trace.truth === null) {
        if (r.ok) deadPicked++;
      } else if (!r.ok) unpicked++;
      else errors.push(Math.abs(r.pick.time - trace.truth) * 1000);
    });
  });
  errors.sort((a, b) => a - b);
  return { snr, traces, picked: errors.length, unpicked, dead_picked: deadPicked, median_abs_error_ms: quantile(errors, 0.5), p95_abs_error_ms: quantile(errors, 0.95) };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const json = process.argv.includes('--json');
  for (const snr of [3, 5, 10, 20]) {
    const m = measurePicker(snr);
    if (json) console.log(JSON.stringify(m));
    else console.log(`SNR ${snr}: ${m.picked}/${m.traces} picked, ${m.unpicked} live unpicked, ${m.dead_picked} dead picked; |error| median ${m.median_abs_error_ms.toFixed(3)} ms, p95 ${m.p95_abs_error_ms.toFixed(3)} ms`);
  }
}
