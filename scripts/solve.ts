/**
 * `npm run solve -- --model M.model.json --picks P.picks.csv [--order 1|2] [--residuals OUT.csv] [--json] [--threads N]`
 * (FORMATS.md §3): forward travel times for every pick with the same engine the worker runs,
 * residuals and misfit. Exit 0 on success, 1 for bad input files, 2 for usage errors.
 * Messages go to stderr as sentences, never stack traces.
 */
import { writeFile } from 'node:fs/promises';
import { parseArgs } from 'node:util';
import { validateSolveInput, EikonalInputError } from '../shared/eikonal';
import { rasteriseModel } from '../shared/model';
import { groupPicksByShot, placeShots } from '../shared/picks';
import { computeResiduals, formatResidualCsv, residualStats, statsByShot, type ResidualInput } from '../shared/residuals';
import { sToMs } from '../shared/units';
import { ShotPool, ShotSolveError } from '../worker/threads/shot-pool';
import { InputError, pickErrors, readModel, readPicks, runCli, threadCount, UsageError } from './lib/cli-inputs';

const USAGE = 'usage: npm run solve -- --model M.model.json --picks P.picks.csv [--order 1|2] [--residuals OUT.csv] [--json] [--threads N]';

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
  const threads = threadCount(values.threads);
  return { model: values.model, picks: values.picks, order: values.order === '1' ? 1 : 2, residuals: values.residuals, json: values.json, threads };
}

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

runCli('solve', USAGE, () => main(process.argv.slice(2)));
