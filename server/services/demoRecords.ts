/**
 * Shot records of the demo line, made by our SEG-2 writer from the demo model (issue 12 item 6):
 * first arrivals at the engine's travel times, a slower and stronger later wave, ground roll, and
 * band-limited noise, so a new user can pick the line from scratch and compare with the stored
 * picks. Deterministic (seeded): the same files at every first start.
 */
import { sampleTime, solveTravelTimes } from '../../shared/eikonal';
import { parseModelFile, rasteriseModel } from '../../shared/model';
import { writeSeg2 } from '../../shared/records';
import { bandLimitedNoise, normals, wavelet, waveletPeak } from '../../shared/records/synthetic-trace';

export interface DemoShot {
  shotId: string;
  x: number;
}

export interface DemoStation {
  station: number;
  x: number;
}

const SAMPLE_INTERVAL = 0.00025;
const SAMPLES = 1024;
/** A 2 ms pre-trigger, as seismographs record (common practice, no source). */
const DELAY = -0.002;
/** Noise RMS relative to the first arrival's peak at zero offset. */
const NOISE = 0.012;
/** Stored as int32 counts; DESCALING_FACTOR turns them back into (invented) millivolts. */
const COUNTS = 2 ** 22;

/** `acquiredDate` as SEG-2 writes it, DD/MMM/YYYY. */
export function demoRecordFiles(modelJson: unknown, stations: DemoStation[], shots: DemoShot[], acquiredDate: string): { fileName: string; bytes: Uint8Array }[] {
  const parsed = parseModelFile(modelJson);
  if (!parsed.ok) throw new Error(`demo model is invalid: ${JSON.stringify(parsed.issues)}`);
  const raster = rasteriseModel(parsed.model);
  const peak = waveletPeak(), rollPeak = waveletPeak(18, 0.25);
  return shots.map((shot, s) => {
    const source = { x: shot.x, z: raster.surfaceZ(shot.x) };
    const times = solveTravelTimes(raster.grid, raster.velocity, raster.active, source, { order: 2, cellSlowness: raster.cellSlowness });
    const next = normals(9100 + s);
    const traces = stations.map((st, k) => {
      const offset = Math.abs(st.x - shot.x);
      const t0 = offset < 1e-9 ? 0 : sampleTime(raster.grid, times, raster.active, { x: st.x, z: raster.surfaceZ(st.x) });
      const amplitude = 1 / (1 + offset / 12);
      const later = t0 + 0.006 + offset / 900;
      const roll = offset / 240;
      const noise = bandLimitedNoise(SAMPLES, SAMPLE_INTERVAL, next);
      const samples = new Float64Array(SAMPLES);
      for (let i = 0; i < SAMPLES; i++) {
        const t = DELAY + i * SAMPLE_INTERVAL;
        const signal = amplitude * (wavelet(t - t0) / peak + 1.5 * wavelet(t - later, 45, 0.2) / peak) + 4 * amplitude * (wavelet(t - roll, 18, 0.25) / rollPeak);
        samples[i] = Math.round(((signal + NOISE * noise[i]) / 6) * COUNTS);
      }
      return { samples, channel: k + 1, sampleInterval: SAMPLE_INTERVAL, delay: DELAY, descale: 1000 / COUNTS, receiver: { x: st.x, y: null, z: null }, source: { x: shot.x, y: null, z: null }, stack: 4 };
    });
    const bytes = writeSeg2(traces, {
      format: 2,
      keywords: [
        ['ACQUISITION_DATE', acquiredDate],
        ['ACQUISITION_TIME', `${String(9 + Math.floor(s / 4)).padStart(2, '0')}:${String((s % 4) * 12 + 5).padStart(2, '0')}:00`],
        ['NOTE', `Invented demo record: line TQ-L1, shot ${shot.shotId}, sledgehammer on a plate, 4 blows stacked`],
      ],
    });
    return { fileName: `${shot.shotId}.sg2`, bytes };
  });
}
