/**
 * Makes the demo line TQ-L1 of the invented scenario: 48 stations at 2.5 m over gentle topography,
 * 7 shots (two off-end, two at the ends, three inside the spread), an invented three-layer model,
 * and first-arrival picks computed with Timefield's own engine plus Gaussian pick noise.
 * Deterministic (seeded), so the committed files can be made again:
 *   node --import tsx scripts/demo/generate-tq-l1.ts
 */
import { writeFileSync } from 'node:fs';
import { solveTravelTimes, sampleTime } from '../../shared/eikonal';
import { parseModelFile, rasteriseModel } from '../../shared/model';

const OUT = 'fixtures/demo';
const SPACING = 2.5;
const STATIONS = 48;
const NOISE_MS = 0.5;
const SHOTS: [string, number][] = [
  ['S1', -10], ['S2', 0], ['S3', 30], ['S4', 58.75], ['S5', 87.5], ['S6', 117.5], ['S7', 127.5],
];

/** mulberry32: a small seeded generator, enough for demo noise. */
function rng(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const uniform = rng(20261201);
const gaussian = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());

// Gentle topography: a low rise towards the middle of the line (invented).
const ground = (x: number) => 100 + 1.6 * Math.sin((Math.PI * x) / 150) - 0.004 * x;
const round = (v: number, d = 2) => Number(v.toFixed(d));

const stations = Array.from({ length: STATIONS }, (_, i) => ({ station: 101 + i, x: i * SPACING, z: round(ground(i * SPACING)) }));
const surface: [number, number][] = [[-20, round(ground(-20))], ...stations.map((s) => [s.x, s.z] as [number, number]), [137.5, round(ground(137.5))]];

const model = {
  format: 'timefield-model/1',
  description: 'Invented demo model for line TQ-L1: topsoil over weathered sandstone over sound sandstone, rockhead deepening to the east',
  grid: { x0: -20, dx: 0.3, nx: 526, z0: 104, dz: 0.3, nz: 101 },
  surface,
  layers: [
    { name: 'topsoil and head', base: [[-20, 98.8], [40, 99.6], [80, 99.2], [137.5, 98.2]], v_top: 380, v_base: 650 },
    { name: 'weathered sandstone', base: [[-20, 94.5], [30, 94], [70, 92], [110, 89.5], [137.5, 89]], v_top: 1300, v_base: 1900 },
    { name: 'sound sandstone', v_top: 3300, v_base: 3900 },
  ],
};

const parsed = parseModelFile(model);
if (!parsed.ok) throw new Error(`demo model is invalid: ${JSON.stringify(parsed.issues)}`);
const raster = rasteriseModel(parsed.model);

const rows = ['shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms'];
for (const [shotId, sx] of SHOTS) {
  const source = { x: sx, z: raster.surfaceZ(sx) };
  const times = solveTravelTimes(raster.grid, raster.velocity, raster.active, source, { order: 2, cellSlowness: raster.cellSlowness });
  for (const s of stations) {
    const atSource = Math.abs(s.x - sx) < 1e-9;
    const t = atSource ? 0 : sampleTime(raster.grid, times, raster.active, { x: s.x, z: raster.surfaceZ(s.x) }) * 1000;
    const picked = atSource ? 0 : Math.max(0.1, t + NOISE_MS * gaussian());
    rows.push(`${shotId},${sx},,${s.x},,${picked.toFixed(2)},${NOISE_MS}`);
  }
}

writeFileSync(`${OUT}/tq-l1.model.json`, JSON.stringify(model, null, 2) + '\n');
/** Map position of chainage x on the invented line: bearing 70° from grid north, turning to 78° at x = 57.5 m. */
function mapPosition(x: number): [number, number] {
  const [e0, n0, bend] = [498200, 6008400, 57.5];
  const along = (e: number, n: number, d: number, deg: number): [number, number] => [e + d * Math.sin((deg * Math.PI) / 180), n + d * Math.cos((deg * Math.PI) / 180)];
  return x <= bend ? along(e0, n0, x, 70) : along(...along(e0, n0, bend, 70), x - bend, 78);
}
writeFileSync(
  `${OUT}/tq-l1.stations.csv`,
  [
    '# Invented demo line TQ-L1: levelled station elevations (m); easting and northing in EPSG:32630 (WGS 84 / UTM zone 30N) at an invented spot, the line bending 8 degrees at x = 57.5 m',
    'station,x,z,easting,northing',
    ...stations.map((s) => `${s.station},${s.x},${s.z},${mapPosition(s.x).map((v) => v.toFixed(3)).join(',')}`),
  ].join('\n') + '\n',
);
writeFileSync(
  `${OUT}/tq-l1.picks.csv`,
  ['# Invented demo picks for line TQ-L1, computed from tq-l1.model.json with Gaussian noise (sigma 0.5 ms); elevations empty = on the ground surface', ...rows].join('\n') + '\n',
);
console.log(`wrote ${STATIONS} stations, ${SHOTS.length} shots, ${rows.length - 1} picks to ${OUT}/tq-l1.*`);
