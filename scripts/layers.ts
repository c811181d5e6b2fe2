/**
 * `npm run layers -- --picks P.picks.csv --model M.model.json [options]` (FORMATS.md §3): the
 * layer methods (GRM, plus–minus, intercept time) on the picks, with the code the interpretation
 * pages use, and no database. M gives the grid and ground surface only. Exit 0 on success,
 * 1 for bad input, 2 for usage errors; messages go to stderr as sentences.
 */
import { readFile } from 'node:fs/promises';
import { parseArgs } from 'node:util';
import { inversionShots } from '../shared/inversion/problem';
import { interpretLayers, layeredModelFromResult, LayerInputError, assignRefractors, type LayerMethod, type LayerResult } from '../shared/layers';
import { median } from '../shared/layers/robust-line';
import { rasteriseModel } from '../shared/model';
import { groupPicksByShot, placeShots, type PlacedShot } from '../shared/picks';
import { InputError, pickErrors, readModel, readPicks, runCli, UsageError, writeOutput } from './lib/cli-inputs';
import { readAssignment } from './lib/assignment-file';

const USAGE = `usage: npm run layers -- --picks P.picks.csv --model M.model.json [--method grm|plus-minus|intercept]
       [--layers 2|3] [--xy D] [--assignment A.csv] [--out OUT.model.json] [--depths OUT.csv] [--json]`;

function readOptions(argv: string[]) {
  let values;
  try {
    ({ values } = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: false,
      options: {
        picks: { type: 'string' },
        model: { type: 'string' },
        method: { type: 'string', default: 'grm' },
        layers: { type: 'string', default: '2' },
        xy: { type: 'string' },
        assignment: { type: 'string' },
        out: { type: 'string' },
        depths: { type: 'string' },
        json: { type: 'boolean', default: false },
        help: { type: 'boolean', default: false },
      },
    }));
  } catch (err) {
    throw new UsageError((err as Error).message);
  }
  const v = values as Record<string, string | boolean | undefined>;
  if (v.help) throw new UsageError('');
  if (!v.picks) throw new UsageError('--picks is required');
  if (!v.model) throw new UsageError('--model is required');
  const method = v.method as string;
  if (method !== 'grm' && method !== 'plus-minus' && method !== 'intercept') throw new UsageError(`--method must be grm, plus-minus or intercept (got ${method})`);
  if (v.layers !== '2' && v.layers !== '3') throw new UsageError(`--layers must be 2 or 3 (got ${v.layers})`);
  let xy: number | undefined;
  if (typeof v.xy === 'string') {
    xy = Number(v.xy);
    if (v.xy.trim() === '' || !Number.isFinite(xy) || xy < 0) throw new UsageError(`--xy must be a distance in metres, 0 or more (got ${v.xy})`);
    if (method !== 'grm') throw new UsageError('--xy is an option of --method grm');
  }
  return {
    picks: v.picks as string,
    model: v.model as string,
    method: method as LayerMethod,
    layers: Number(v.layers) as 2 | 3,
    xy,
    assignment: v.assignment as string | undefined,
    out: v.out as string | undefined,
    depths: v.depths as string | undefined,
    json: v.json === true,
  };
}

const round = (v: number, digits: number): number => +v.toFixed(digits);

function depthsCsv(result: LayerResult): string {
  const rows = [...result.depths]
    .sort((a, b) => a.refractor - b.refractor || a.x - b.x)
    .map((d) => `${round(d.x, 3)},${round(d.groundZ, 3)},${d.refractor},${round(d.depth, 3)},${round(d.refractorZ, 3)},${Math.round(d.refractorVelocity)}`);
  return `receiver_x,ground_z,refractor,depth_m,refractor_z,refractor_velocity\n${rows.join('\n')}\n`;
}

async function main(argv: string[]): Promise<void> {
  const opts = readOptions(argv);
  const model = await readModel(opts.model);
  const picks = await readPicks(opts.picks);
  const raster = rasteriseModel(model);
  const placement = placeShots(raster, groupPicksByShot(picks));
  if (!placement.ok) throw new InputError(pickErrors(opts.picks, 'picks do not fit the model', placement.errors));
  const placed: PlacedShot[] = placement.shots;
  const shots = inversionShots(placed);
  let assignment;
  if (opts.assignment) {
    const automatic = assignRefractors(shots, opts.layers);
    assignment = await readAssignment(opts.assignment, placed, automatic, opts.layers, (path) => readFile(path, 'utf8'));
  }
  let result: LayerResult;
  try {
    result = interpretLayers(shots, raster.surfaceZ, { method: opts.method, layers: opts.layers, xy: opts.xy, assignment });
  } catch (err) {
    if (err instanceof LayerInputError) throw new InputError(`${opts.picks}: ${err.message}`);
    throw err;
  }
  if (!result.depths.length) throw new InputError(`${opts.picks}: no geophone has a depth: no geophone lies between reversed shots on the refractor`);
  if (result.velocities.some((v) => !Number.isFinite(v))) throw new InputError(`${opts.picks}: a layer velocity could not be found from these picks`);

  if (opts.depths) await writeOutput(opts.depths, depthsCsv(result), 'depth table');
  if (opts.out) await writeOutput(opts.out, `${JSON.stringify(layeredModelFromResult(result, model), null, 1)}\n`, 'model file');

  const deepest = result.depths.filter((d) => d.refractor === result.velocities.length - 1).map((d) => d.depth);
  for (const w of result.warnings) process.stderr.write(`layers: warning: ${w}\n`);
  const geophones = new Set(result.depths.map((d) => d.x)).size;
  const summary = {
    method: opts.method,
    geophones,
    xy_m: result.xy === null ? null : round(result.xy, 3),
    layers: result.velocities.map((v) => ({ velocity: Math.round(v) })),
    depth_m: deepest.length ? { min: round(Math.min(...deepest), 2), median: round(median(deepest), 2), max: round(Math.max(...deepest), 2) } : null,
    warnings: result.warnings,
  };
  if (opts.json) {
    process.stdout.write(`${JSON.stringify(summary)}\n`);
  } else {
    process.stdout.write(
      [
        `method     ${opts.method}${result.xy !== null ? `, XY ${round(result.xy, 2)} m` : ''}; ${placed.length} shots, ${picks.length} picks`,
        `velocities ${result.velocities.map((v) => `${Math.round(v)} m/s`).join(' over ')}`,
        `depths     ${geophones} geophones${summary.depth_m ? `, deepest refractor ${summary.depth_m.min}–${summary.depth_m.max} m (median ${summary.depth_m.median} m)` : ''}`,
      ].join('\n') + '\n',
    );
  }
}

runCli('layers', USAGE, () => main(process.argv.slice(2)));
