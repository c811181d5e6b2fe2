/**
 * The invented three-layer line of docs/inversion.md and docs/uncertainty.md: topography and an
 * undulating refractor (soil 450–550 m/s, weathered rock 1300–1500 m/s, rock 3200–3400 m/s), 48
 * geophones every 2 m, 11 shots, first arrivals computed on a 0.25 m grid with 0.5 ms of seeded noise,
 * and the same ground rasterised on the 1 m grid the figures invert on.
 */
import { sampleTime, solveTravelTimes } from '../../shared/eikonal';
import { normalDeviates } from '../../shared/inversion/checkerboard';
import { rasteriseModel, type ModelFile } from '../../shared/model';

export const surface: [number, number][] = [[-10, 101], [20, 102.5], [50, 101.5], [80, 99.5], [110, 100]];
export const base1: [number, number][] = [[-10, 97], [30, 97.5], [60, 96], [110, 95.5]];
export const base2: [number, number][] = [[-10, 90], [20, 88], [45, 91], [70, 87], [110, 89]];
const truth = (dx: number) => ({
  format: 'timefield-model/1',
  grid: { x0: -10, dx, nx: 120 / dx + 1, z0: 104, dz: dx, nz: 34 / dx + 1 },
  surface,
  layers: [
    { name: 'soil', base: base1, v_top: 450, v_base: 550 },
    { name: 'weathered rock', base: base2, v_top: 1300, v_base: 1500 },
    { name: 'rock', v_top: 3200, v_base: 3400 },
  ],
}) as unknown as ModelFile;

export const geophones = Array.from({ length: 48 }, (_, i) => 2 * i + 3);
export const shotXs = [-5, 3, 15, 27, 39, 51, 63, 75, 87, 97, 105];

/** The picks (times from the fine grid plus noise) and the 1 m grid to invert them on. */
export function threeLayerSurvey() {
  const fine = rasteriseModel(truth(0.25));
  const noise = normalDeviates(2026);
  const shots = shotXs.map((sx) => {
    const source = { x: sx, z: fine.surfaceZ(sx) };
    const T = solveTravelTimes(fine.grid, fine.velocity, fine.active, source, { cellSlowness: fine.cellSlowness });
    const xs = geophones.filter((x) => x !== sx);
    return {
      shotId: `S${sx}`,
      source,
      receivers: Float64Array.from(xs.flatMap((x) => [x, fine.surfaceZ(x)])),
      times: Float64Array.from(xs, (x) => sampleTime(fine.grid, T, fine.active, { x, z: fine.surfaceZ(x) }) + 0.0005 * noise()),
      sigmas: new Float64Array(xs.length).fill(0.0005),
    };
  });
  return { shots, coarse: rasteriseModel(truth(1)) };
}
