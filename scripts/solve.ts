/**
 * `npm run solve -- --model M.model.json --picks P.picks.csv [--order 1|2] [--residuals OUT.csv] [--json] [--threads N]`
 * (FORMATS.md §3): forward travel times for every pick with the same engine the worker runs,
 * residuals and misfit. Exit 0 on success, 1 for bad input files, 2 for usage errors.
 * Messages go to stderr as sentences, never stack traces.
 */
import { createReadStream } from 'node:fs';
import { readFile, writeFile } from 'node:fs/promises';
import { parseArgs } from 'node:util';
import { validateSolveInput, EikonalInputError } from '../shared/eikonal';
import { formatModelIssues, parseModelFile, rasteriseModel } from '../shared/model';
import { createPickParser, formatPickError, groupPicksByShot, placeShots, type Pick, type PickError } from '../shared/picks';
import { computeResiduals, formatResidualCsv, residualStats, statsByShot, type ResidualInput } from '../shared/residuals';
import { sToMs } from '../shared/units';
import { defaultThreadCount, ShotPool, ShotSolveError } from '../worker/threads/shot-pool';

const USAGE = 'usage: npm run solve -- --model M.model.json --picks P.picks.csv [--order 1|2] [--residuals OUT.csv] [--json] [--threads N]';

class UsageError extends Error {}
/** Bad input files or positions: exit 1. */
class InputError extends Error {}

interface CliOptions {
  model: string;
  picks: string;
  order: 1 | 2;
  residuals?: string;
  json: boolean;
  threads: number;
}

function readOptions(argv: string[]): CliOptions {
  let values;
  try {
    ({ values } = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: false,
      options: {
        model: { type: 'string' },
        picks: { type: 'string' },
        order: { type: 'string', default: '2' },
        residuals: { type: 'string' },
        json: { type: 'boolean', default: false },
        threads: { type: 'string' },
        help: { type: 'boolean', default: false },
      },
    }));
  } catch (err) {
    throw new UsageError((err as Error).message);
  }
  if (values.help) throw new UsageError('');
  if (!values.model) throw new UsageError('--model is required');
  if (!values.picks) throw new UsageError('--picks is required');
  if (values.order !== '1' && values.order !== '2') throw new UsageError(`--order must be 1 or 2 (got ${values.order})`);
  const threads = values.threads === undefined ? defaultThreadCount() : Number(values.threads);
  if (!Number.isInteger(threads) || threads < 1 || threads > 256) throw new UsageError(`--threads must be a whole number from 1 to 256 (got ${values.threads})`);
  return { model: values.model, picks: values.picks, order: values.order === '1' ? 1 : 2, residuals: values.residuals, json: values.json, threads };
}

async function readModel(path: string) {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (err) {
    throw new InputError(`${path}: cannot read the model file (${(err as NodeJS.ErrnoException).code ?? (err as Error).message})`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (err) {
    throw new InputError(`${path}: not valid JSON (${(err as Error).message})`);
  }
  const parsed = parseModelFile(json);
  if (!parsed.ok) throw new InputError(`${path}: the model file has errors:\n${indent(formatModelIssues(parsed.issues))}`);
  return parsed.model;
}

/** Streams the file through the chunked parser (never holds more than one chunk of text plus the picks). */
async function readPicks(path: string): Promise<Pick[]> {
  const parser = createPickParser();
  try {
    for await (const chunk of createReadStream(path, { encoding: 'utf8', highWaterMark: 1 << 16 })) parser.push(chunk as string);
  } catch (err) {
    throw new InputError(`${path}: cannot read the pick file (${(err as NodeJS.ErrnoException).code ?? (err as Error).message})`);
  }
  const result = parser.finish();
  if (!result.ok) throw new InputError(pickErrors(path, 'the pick file has errors', result.errors));
  return result.picks;
}

const indent = (text: string): string => text.split('\n').map((l) => `  ${l}`).join('\n');
const pickErrors = (path: string, what: string, errors: PickError[]): string =>
  `${path}: ${what}:\n${indent(errors.map(formatPickError).join('\n'))}`;
const round = (v: number, digits: number): number => +v.toFixed(digits);

async function main(argv: string[]): Promise<void> {
  const opts = readOptions(argv);
  const model = await readModel(opts.model);
  const picks = await readPicks(opts.picks);
  const raster = rasteriseModel(model);
  const placement = placeShots(raster, groupPicksByShot(picks));
  if (!placement.ok) throw new InputError(pickErrors(opts.picks, 'picks do not fit the model', placement.errors));
  const shots = placement.shots;
  for (const shot of shots) {
    try {
      validateSolveInput(raster.grid, raster.velocity, raster.active, shot.source);
    } catch (err) {
      if (err instanceof EikonalInputError) throw new InputError(`${opts.picks}: shot ${shot.shotId} (line ${shot.picks[0].line}): ${err.message}`);
      throw err;
    }
  }

  const pool = new ShotPool(opts.threads);
  let solved;
  try {
    await pool.warmUp();
    solved = await pool.solveAll(raster.grid, raster, shots, opts.order);
  } catch (err) {
    if (err instanceof ShotSolveError) throw new InputError(`shot ${shots[err.jobIndex].shotId}: ${err.message}`);
    throw err;
  } finally {
    await pool.close();
  }

  const inputs: ResidualInput[] = [];
  shots.forEach((shot, s) => {
    shot.picks.forEach((p, i) => {
      const computed = solved.times[s][i];
      if (!Number.isFinite(computed)) {
        throw new InputError(`${opts.picks}: line ${p.line}: receiver at x ${p.receiverX} m cannot be reached from shot ${shot.shotId} (cut off by air)`);
      }
      inputs.push({ shotId: shot.shotId, receiverX: p.receiverX, receiverZ: shot.receivers[2 * i + 1], observed: p.time, computed, sigma: p.sigma });
    });
  });
  const residuals = computeResiduals(inputs);
  const stats = residualStats(residuals);
  if (opts.residuals) {
    try {
      await writeFile(opts.residuals, formatResidualCsv(residuals));
    } catch (err) {
      throw new InputError(`${opts.residuals}: cannot write the residual file (${(err as NodeJS.ErrnoException).code ?? (err as Error).message})`);
    }
  }

  let activeNodes = 0;
  for (const a of raster.active) activeNodes += a;
  const summary = {
    shots: shots.length,
    picks: residuals.length,
    nodes: activeNodes,
    order: opts.order,
    rms_ms: round(sToMs(stats.rms ?? 0), 6),
    max_abs_residual_ms: round(sToMs(stats.maxAbs ?? 0), 6),
    chi2: round(stats.chi2 ?? 0, 6),
    solve_seconds: round(solved.wallSeconds, 6),
    nodes_per_second: Math.round((activeNodes * shots.length) / solved.wallSeconds),
  };
  if (opts.json) {
    process.stdout.write(`${JSON.stringify(summary)}\n`);
    return;
  }
  const { nx, nz } = raster.grid;
  const lines = [
    `model      ${opts.model}: ${nx} × ${nz} nodes, ${activeNodes.toLocaleString('en-US')} in the ground`,
    `picks      ${opts.picks}: ${residuals.length} picks in ${shots.length} shots`,
    `solver     order ${opts.order}, ${opts.threads} thread(s): ${summary.solve_seconds.toFixed(3)} s, ${(summary.nodes_per_second / 1e6).toFixed(2)} million nodes/s`,
    `misfit     RMS ${summary.rms_ms.toFixed(3)} ms, max |residual| ${summary.max_abs_residual_ms.toFixed(3)} ms, chi² per pick ${summary.chi2.toFixed(3)}`,
    '',
    'shot       picks   RMS ms   mean ms   max|r| ms   chi²',
    ...statsByShot(residuals).map((s) =>
      `${s.shotId.padEnd(10)} ${String(s.count).padStart(5)} ${sToMs(s.rms!).toFixed(3).padStart(8)} ${sToMs(s.mean!).toFixed(3).padStart(9)} ${sToMs(s.maxAbs!).toFixed(3).padStart(11)} ${s.chi2!.toFixed(3).padStart(6)}`),
  ];
  if (opts.residuals) lines.push('', `residuals written to ${opts.residuals}`);
  lines.push('', 'Forward-model misfit only: a small misfit does not make the model unique. Calibrate against boreholes;');
  lines.push('interpretations need review by a qualified professional, and local codes govern design.');
  process.stdout.write(`${lines.join('\n')}\n`);
}

main(process.argv.slice(2)).then(
  () => {
    process.exitCode = 0;
  },
  (err: unknown) => {
    if (err instanceof UsageError) {
      process.stderr.write(`${err.message ? `solve: ${err.message}\n` : ''}${USAGE}\n`);
      process.exitCode = 2;
    } else if (err instanceof InputError) {
      process.stderr.write(`solve: ${err.message}\n`);
      process.exitCode = 1;
    } else {
      process.stderr.write(`solve: internal error: ${err instanceof Error ? err.message : String(err)}\n`);
      process.exitCode = 1;
    }
  },
);
