/**
 * Solver benchmark: `npm run bench` prints a table; `npm run bench -- --json` prints one JSON
 * object per case per line (FORMATS.md §3). Options: --quick (two smallest sizes, fewer
 * repeats), --case <text> (only cases whose name contains it), --repeats <n>.
 * Single thread; speed is the median wall time of repeated solves after one warm-up solve.
 * The table ends with a calibration: the engine timed alternately with a plain fast-marching
 * solver, a cost ratio that stays put while the machine's speed drifts.
 */
import { dippingCase, gradientCase, homogeneousCase, SIZES, twoLayerCase, twoLayerModelCase, type BenchCase } from './bench/cases';
import { calibrate } from './bench/calibrate';
import { buildCompiledReference, checksumAgreement, compareWithCompiled } from './bench/compiled-reference';
import { runCase, type BenchResult } from './bench/measure';
import { hillCase, measureSurfaceCase, slopeCase, valleyCase } from './bench/surface-cases';

interface Args {
  json: boolean;
  quick: boolean;
  filter: string;
  repeats: number | undefined;
}

function parseArgs(argv: string[]): Args {
  const args: Args = { json: false, quick: false, filter: '', repeats: undefined };
  for (let k = 0; k < argv.length; k++) {
    const a = argv[k];
    if (a === '--json') args.json = true;
    else if (a === '--quick') args.quick = true;
    else if (a === '--case') args.filter = argv[++k] ?? '';
    else if (a === '--repeats') args.repeats = Number(argv[++k]);
    else {
      console.error(`unknown option ${a}; use --json, --quick, --case <text>, --repeats <n>`);
      process.exit(2);
    }
  }
  if (args.repeats !== undefined && !(Number.isInteger(args.repeats) && args.repeats > 0)) {
    console.error('--repeats needs a whole number above 0');
    process.exit(2);
  }
  return args;
}

/** Fewer repeats on big grids keeps the whole run within a few minutes. */
function repeatsFor(c: BenchCase, args: Args): number {
  if (args.repeats) return args.repeats;
  const n = c.grid.nx * c.grid.nz;
  if (args.quick) return 3;
  return n <= 100_000 ? 15 : n <= 300_000 ? 9 : 5;
}

function* cases(args: Args): Generator<BenchCase> {
  const sizes = args.quick ? SIZES.slice(0, 2) : SIZES;
  for (const [nx, nz] of sizes) yield homogeneousCase(nx, nz);
  for (const [nx, nz] of sizes) yield gradientCase(nx, nz);
  yield twoLayerCase();
  yield twoLayerModelCase();
  yield dippingCase();
}

const pct = (v: number): string => `${(v * 100).toFixed(3)} %`;

function printRow(r: BenchResult): void {
  console.log(
    [
      r.case.padEnd(24),
      `${r.nx}×${r.nz}`.padStart(10),
      String(r.order).padStart(5),
      (r.median_seconds * 1000).toFixed(1).padStart(10),
      (r.nodes_per_second / 1e6).toFixed(2).padStart(9),
      (r.cpu_median_seconds * 1000).toFixed(1).padStart(8),
      pct(r.max_rel_error).padStart(10),
      pct(r.mean_rel_error).padStart(10),
      String(r.measured_nodes).padStart(9),
    ].join(' '),
  );
}

function main(): void {
  const args = parseArgs(process.argv.slice(2));
  if (!args.json) {
    console.log(`Eikonal benchmark — node ${process.version}, single thread, medians of repeated solves`);
    console.log(['case'.padEnd(24), 'grid'.padStart(10), 'order'.padStart(5), 'median ms'.padStart(10), 'Mnodes/s'.padStart(9), 'cpu ms'.padStart(8), 'max err'.padStart(10), 'mean err'.padStart(10), 'measured'.padStart(9)].join(' '));
  }
  for (const c of cases(args)) {
    if (args.filter && !c.name.includes(args.filter)) continue;
    for (const order of [1, 2] as const) {
      const r = runCase(c, { order }, repeatsFor(c, args));
      if (args.json) {
        // Exactly the contract's fields (FORMATS.md §3).
        const { case: name, nx, nz, order: o, median_seconds, nodes_per_second, max_rel_error, mean_rel_error } = r;
        console.log(JSON.stringify({ case: name, nx, nz, order: o, median_seconds, nodes_per_second, max_rel_error, mean_rel_error }));
      } else {
        printRow(r);
      }
    }
  }
  if (!args.json) printSurfaceTable(args.filter);
  if (!args.json && !args.filter) printCalibration(args.quick);
}

/** Uniform ground under topography, surface shots and geophones, exact in-ground path times (issue 14). */
function printSurfaceTable(filter: string): void {
  const list = [hillCase, valleyCase, () => slopeCase(10), () => slopeCase(25)].map((f) => f()).filter((c) => !filter || c.name.includes(filter));
  if (list.length === 0) return;
  console.log('\nGround surface: uniform 1500 m/s, 0.5 m grid, order 2, geophones read with sampleTime');
  console.log(['case'.padEnd(24), 'max ms'.padStart(9), 'rms ms'.padStart(9), 'max rel'.padStart(10), 'earliest ms'.padStart(12), 'geophones'.padStart(10)].join(' '));
  for (const c of list) {
    const e = measureSurfaceCase(c);
    console.log([c.name.padEnd(24), e.maxMs.toFixed(4).padStart(9), e.rmsMs.toFixed(4).padStart(9), pct(e.maxRel).padStart(10), e.earliestMs.toFixed(4).padStart(12), String(e.count).padStart(10)].join(' '));
  }
}

function printCalibration(quick: boolean): void {
  const c = gradientCase(...(quick ? SIZES[1] : SIZES[2]));
  printCompiledComparison(c, quick);
  console.log(`\nCalibration on ${c.name}: engine and a plain first-order fast marcher (binary heap), timed alternately`);
  for (const order of [1, 2] as const) {
    const k = calibrate(c, order, quick ? 5 : 15);
    const plainRate = (c.grid.nx * c.grid.nz) / k.plainSeconds / 1e6;
    console.log(
      `  order ${order}: engine ${(k.engineSeconds * 1000).toFixed(1)} ms, plain ${(k.plainSeconds * 1000).toFixed(1)} ms ` +
        `(${plainRate.toFixed(2)} Mnodes/s); engine costs ${k.costRatio.toFixed(2)}× the plain solve`,
    );
  }
}

/** The engine's speed as a fraction of a compiled C fast marcher's on the same grid (issue target: ≥ 0.7 at order 2). */
function printCompiledComparison(c: BenchCase, quick: boolean): void {
  const built = buildCompiledReference();
  if ('error' in built) {
    console.log(`\nCompiled reference skipped: ${built.error}`);
    return;
  }
  const agreement = checksumAgreement(built.binary, c);
  console.log(`\nCompiled reference on ${c.name}: scripts/bench/plain-fmm.c (gcc -O2, binary heap, one thread), timed alternately with the engine`);
  console.log(`  its first-order times agree with the TypeScript plain marcher's to ${agreement.toExponential(1)} (sum over the grid)`);
  for (const order of [1, 2] as const) {
    const k = compareWithCompiled(built.binary, c, order, quick ? 3 : 9);
    console.log(
      `  order ${order}: engine ${(k.engineSeconds * 1000).toFixed(1)} ms, compiled ${(k.compiledSeconds * 1000).toFixed(1)} ms; ` +
        `engine speed = ${k.speedRatio.toFixed(2)}× the compiled solver's`,
    );
  }
}

main();
