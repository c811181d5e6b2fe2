/**
 * `npm run invert -- --model M.model.json --picks P.picks.csv [options]` (FORMATS.md §3):
 * travel-time tomography of the picks on M's grid and ground surface, with the engine the
 * worker's inversion job runs, shots on all cores. Exit 0 on success, 1 for bad input files,
 * 2 for usage errors. Messages go to stderr as sentences.
 */
import { parseArgs } from 'node:util';
import { validateSolveInput, EikonalInputError } from '../shared/eikonal';
import { gradientStart, invert, inversionDataProblems, inversionShots, InversionInputError, type InversionResult } from '../shared/inversion';
import { MODEL_FORMAT } from '../shared/schemas/model';
import { inversionSettingsInput } from '../shared/schemas/inversions';
import { rasteriseModel } from '../shared/model';
import { groupPicksByShot, placeShots } from '../shared/picks';
import { computeResiduals, formatResidualCsv, type ResidualInput } from '../shared/residuals';
import { ForwardStepError, SensitivityPool } from '../worker/threads/sensitivity-pool';
import { InputError, pickErrors, readModel, readPicks, runCli, threadCount, UsageError, writeOutput } from './lib/cli-inputs';

const USAGE = `usage: npm run invert -- --model M.model.json --picks P.picks.csv [--start model|gradient] [--iterations N]
       [--smoothing W] [--vertical-weight R] [--damping D] [--vmin V] [--vmax V] [--order 1|2]
       [--checkerboard] [--checker-size M] [--out OUT.model.json] [--residuals OUT.csv] [--json] [--threads N]`;

const NUMBER_OPTIONS = {
  iterations: 'maxIterations',
  smoothing: 'smoothing',
  'vertical-weight': 'verticalWeight',
  damping: 'damping',
  vmin: 'vMin',
  vmax: 'vMax',
  order: 'order',
  'checker-size': 'checkerSize',
} as const;

function readOptions(argv: string[]) {
  let values;
  try {
    ({ values } = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: false,
      options: {
        model: { type: 'string' },
        picks: { type: 'string' },
        start: { type: 'string', default: 'model' },
        ...Object.fromEntries(Object.keys(NUMBER_OPTIONS).map((k) => [k, { type: 'string' as const }])),
        checkerboard: { type: 'boolean', default: false },
        out: { type: 'string' },
        residuals: { type: 'string' },
        json: { type: 'boolean', default: false },
        threads: { type: 'string' },
        help: { type: 'boolean', default: false },
      },
    }));
  } catch (err) {
    throw new UsageError((err as Error).message);
  }
  const v = values as Record<string, string | boolean | undefined>;
  if (v.help) throw new UsageError('');
  if (!v.model) throw new UsageError('--model is required');
  if (!v.picks) throw new UsageError('--picks is required');
  if (v.start !== 'model' && v.start !== 'gradient') throw new UsageError(`--start must be model or gradient (got ${v.start})`);
  const given: Record<string, number | boolean> = { checkerboard: v.checkerboard === true };
  for (const [flag, key] of Object.entries(NUMBER_OPTIONS)) {
    const text = v[flag];
    if (typeof text !== 'string') continue;
    const num = Number(text);
    if (text.trim() === '' || !Number.isFinite(num)) throw new UsageError(`--${flag} must be a number (got ${text})`);
    given[key] = num;
  }
  const settings = inversionSettingsInput.safeParse(given);
  if (!settings.success) {
    const flagOf = (key: PropertyKey) => Object.entries(NUMBER_OPTIONS).find(([, k]) => k === key)?.[0] ?? String(key);
    throw new UsageError(settings.error.issues.map((i) => `--${flagOf(i.path[0])}: ${i.message}`).join('; '));
  }
  const threads = threadCount(v.threads as string | undefined);
  return {
    model: v.model as string,
    picks: v.picks as string,
    start: v.start as 'model' | 'gradient',
    settings: settings.data,
    out: v.out as string | undefined,
    residuals: v.residuals as string | undefined,
    json: v.json === true,
    threads,
  };
}

const round = (v: number, digits: number): number => +v.toFixed(digits);

async function main(argv: string[]): Promise<void> {
  const t0 = performance.now();
  const opts = readOptions(argv);
  const model = await readModel(opts.model);
  const picks = await readPicks(opts.picks);
  const raster = rasteriseModel(model);
  const placement = placeShots(raster, groupPicksByShot(picks));
  if (!placement.ok) throw new InputError(pickErrors(opts.picks, 'picks do not fit the model', placement.errors));
  for (const shot of placement.shots) {
    try {
      validateSolveInput(raster.grid, raster.velocity, raster.active, shot.source);
    } catch (err) {
      if (err instanceof EikonalInputError) throw new InputError(`${opts.picks}: shot ${shot.shotId} (line ${shot.picks[0].line}): ${err.message}`);
      throw err;
    }
  }
  const shots = inversionShots(placement.shots);
  let ground = 0;
  for (const a of raster.active) ground += a;
  const problems = inversionDataProblems(shots, ground);
  if (problems.length) throw new InputError(`${opts.picks}: ${problems.join('; ')}`);

  const { grid, active } = raster;
  const start = opts.start === 'gradient' ? gradientStart(grid, active, raster.surfaceZ, shots, opts.settings).velocity : raster.velocity;
  // A saved model's own structure (its layers) is kept: the smoothing measures the change from it.
  const problem = { grid, active, start, shots, settings: opts.settings, surface: raster.surface, smoothingActsOn: opts.start === 'model' ? ('departure' as const) : ('model' as const) };
  const pool = new SensitivityPool(opts.threads);
  let result: InversionResult;
  try {
    result = await invert(problem, pool.modeller(problem), {
      onIteration: (r) => {
        if (!opts.json) process.stderr.write(`iteration ${String(r.iteration).padStart(2)}: chi² ${r.chi2.toFixed(3)}, RMS ${r.rmsMs.toFixed(3)} ms\n`);
      },
    });
  } catch (err) {
    if (err instanceof InversionInputError || err instanceof ForwardStepError) throw new InputError(err.message);
    throw err;
  } finally {
    await pool.close();
  }

  if (opts.out) await writeOutput(opts.out, outModel(model, result), 'model file');
  if (opts.residuals) {
    const inputs: ResidualInput[] = [];
    let at = 0;
    for (const shot of placement.shots) {
      shot.picks.forEach((p, i) => {
        const computed = result.computed[at++];
        if (Number.isFinite(computed)) inputs.push({ shotId: shot.shotId, receiverX: p.receiverX, receiverZ: shot.receivers[2 * i + 1], observed: p.time, computed, sigma: p.sigma });
      });
    }
    await writeOutput(opts.residuals, formatResidualCsv(computeResiduals(inputs)), 'residual file');
  }

  const last = result.history[result.history.length - 1];
  const summary = {
    picks: result.computed.length,
    shots: shots.length,
    iterations: last.iteration,
    chi2: round(last.chi2, 6),
    rms_ms: round(last.rmsMs, 6),
    chi2_history: result.history.map((h) => round(h.chi2, 6)),
    rms_ms_history: result.history.map((h) => round(h.rmsMs, 6)),
    seconds: round((performance.now() - t0) / 1000, 3),
    stop_reason: result.stopReason,
    timings: { forward_seconds: round(result.timings.forwardSeconds, 3), matrix_seconds: round(result.timings.matrixSeconds, 3), lsqr_seconds: round(result.timings.lsqrSeconds, 3) },
    ...(result.checkerboard ? { checkerboard_correlation: round(result.checkerboard.correlation, 4), checker_size_m: result.checkerboard.size } : {}),
  };
  if (opts.json) {
    process.stdout.write(`${JSON.stringify(summary)}\n`);
    return;
  }
  const lines = [
    `model      ${opts.model}: ${grid.nx} × ${grid.nz} nodes, ${ground.toLocaleString('en-US')} in the ground; start: ${opts.start}`,
    `picks      ${opts.picks}: ${summary.picks} picks in ${shots.length} shots`,
    `result     ${summary.iterations} iterations (${result.stopReason}), chi² ${summary.chi2.toFixed(3)}, RMS ${summary.rms_ms.toFixed(3)} ms, ${summary.seconds} s`,
  ];
  if (result.checkerboard) lines.push(`checkers   ${result.checkerboard.size} m squares ±7 %: correlation ${result.checkerboard.correlation.toFixed(3)} over covered nodes`);
  if (opts.out) lines.push(`model written to ${opts.out}`);
  if (opts.residuals) lines.push(`residuals written to ${opts.residuals}`);
  lines.push('', 'A tomogram smooths sharp contacts, loses resolution with depth and may miss hidden layers or velocity');
  lines.push('inversions; it is not unique. Calibrate against boreholes; interpretations need review by a qualified');
  lines.push('professional, and local codes govern design.');
  process.stdout.write(`${lines.join('\n')}\n`);
}

/** The result as a raw-velocity model file (FORMATS.md §1), air as null, with coverage and doi. */
function outModel(model: { grid: object; surface?: unknown }, r: InversionResult): string {
  const nullable = (a: ArrayLike<number>, digits: number) => Array.from(a, (v) => (Number.isFinite(v) ? round(v, digits) : null));
  return JSON.stringify({
    format: MODEL_FORMAT,
    grid: model.grid,
    ...(model.surface ? { surface: model.surface } : {}),
    velocity: nullable(r.velocity, 1),
    coverage: Array.from(r.coverage, (v) => round(v, 3)),
    doi: nullable(r.doi, 3),
  });
}

runCli('invert', USAGE, () => main(process.argv.slice(2)));
