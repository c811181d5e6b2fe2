/**
 * Browser side of `npm run bench:draw`: 48 traces × 4000 samples drawn on a 1200 × 700 canvas, the
 * way the record view draws them, timed with a flush of the canvas after each draw.
 */
import { drawRecord, type RecordDrawing } from '../../src/components/records/drawRecord';
import { fullView } from '../../src/components/records/recordGeometry';
import { prepareTraces } from '../../src/lib/traces/prepare';
import { bandLimitedNoise, normals, wavelet } from '../../shared/records/synthetic-trace';

const TRACES = 48, SAMPLES = 4000, DT = 0.00025;

function record() {
  const next = normals(3);
  return Array.from({ length: TRACES }, (_, k) => {
    const noise = bandLimitedNoise(SAMPLES, DT, next);
    const t0 = 0.004 + k * 0.0012;
    return { samples: Float64Array.from({ length: SAMPLES }, (_, i) => wavelet(i * DT - t0) + 0.05 * noise[i]), sampleInterval: DT, delay: 0 };
  });
}

const median = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];

export function run(rounds: number): Record<string, number> {
  const canvas = document.createElement('canvas');
  canvas.width = 1200;
  canvas.height = 700;
  document.body.appendChild(canvas);
  const ctx = canvas.getContext('2d')!;
  const input = record();
  const out: Record<string, number> = {};
  const plain = { band: { lowHz: null, highHz: null, order: 4 as const }, agcMs: 0, normalise: 'trace' as const };
  const processed = { band: { lowHz: 20, highHz: 400, order: 4 as const }, agcMs: 50, normalise: 'trace' as const };
  for (const [name, p] of [['plain', plain], ['agc_bandpass', processed]] as const) {
    const times: number[] = [];
    for (let r = 0; r < rounds; r++) {
      const t = performance.now();
      prepareTraces(input, p);
      times.push(performance.now() - t);
    }
    out[`prepare_${name}_ms`] = median(times);
  }
  const traces = prepareTraces(input, plain);
  for (const mode of ['wiggle', 'density', 'both'] as const) {
    const drawing: RecordDrawing = {
      traces,
      dtMs: traces.map(() => DT * 1000),
      delayMs: traces.map(() => 0),
      shiftMs: traces.map(() => 0),
      labels: traces.map((_, i) => String(i + 1)),
      view: fullView(TRACES, 0, (SAMPLES - 1) * DT * 1000),
      wiggle: mode !== 'density',
      density: mode !== 'wiggle',
      gain: 1.5,
      clip: 1,
      picks: traces.map(() => null),
      selected: 3,
    };
    const times: number[] = [];
    for (let r = 0; r < rounds; r++) {
      const t = performance.now();
      drawRecord(ctx, 1200, 700, drawing);
      ctx.getImageData(0, 0, 1, 1); // wait for the canvas to finish drawing
      times.push(performance.now() - t);
    }
    out[`draw_${mode}_ms`] = median(times);
  }
  return out;
}
