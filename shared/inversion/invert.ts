/**
 * The inversion loop: Gauss–Newton steps on node slowness, each solved with LSQR (system.ts),
 * the rays and matrix rebuilt from the new model every time.
 *
 * Regularisation weight, automatic: a decreasing schedule stopped by the discrepancy principle.
 * The first step is heavily smoothed (λ = 50, chosen by measurement: from a uniform start it
 * reached χ² ≈ 1 in 9 steps where λ = 10 took 21); each step that leaves χ² above 1.1 halves λ for the
 * next, down to a floor of 0.01; a step that overshoots (χ² < 0.9) doubles it. The misfit thus falls
 * through ever rougher models and the first model that fits the picks to their uncertainty is the
 * smoothest one reached (Morozov's discrepancy principle and continuation in the weight: Aster,
 * Borchers & Thurber 2018, §4.4 and §10.2; Haber, Ascher & Oldenburg 2000, Inverse Problems 16,
 * 1263–1280, "cooling"; from memory). A weight given by the user is kept fixed.
 *
 * A step that makes the misfit worse is halved once; if that is still worse the model stays and
 * λ is raised fourfold (three times at most). A step that changes χ² by less than 2 % halves λ
 * (the smoothing is what holds the model back). Stops: χ² within [0.9, 1.1]; χ² changing by less
 * than 2 % in a step while λ cannot fall further (fixed, or at its floor); the iteration cap;
 * cancellation (the AbortSignal).
 */
import { CHECKER_AMPLITUDE, autoCheckerSize, checkerPattern, correlation, normalDeviates } from './checkerboard';
import { depthOfInvestigation, rayCoverage } from './coverage';
import { CsrMatrix } from './csr';
import { lsqr } from './lsqr';
import { misfit, observed, type Misfit } from './misfit';
import { buildStep, secondDifferenceStencils, toUnknownColumns } from './system';
import type {
  CheckerboardResult, ForwardModeller, ForwardResult, InversionCheckpoint, InversionHooks, InversionProblem,
  InversionResult, IterationRecord, StopReason, Timings,
} from './types';

export const AUTO_SMOOTHING_START = 50;
export const AUTO_SMOOTHING_FLOOR = 0.01;
export const TARGET_CHI2 = { low: 0.9, high: 1.1 };
export const STALL_CHANGE = 0.02;
/** LSQR iterations per step: the step is a direction to be refined by the next linearisation, not an exact solution. */
const LSQR_ITERATIONS = 150;

export class InversionInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'InversionInputError';
  }
}

function checkProblem(p: InversionProblem): void {
  const n = p.grid.nx * p.grid.nz;
  const s = p.settings;
  if (p.active.length !== n || p.start.length !== n) throw new InversionInputError(`the ground mask and starting model must have nx × nz = ${n} values`);
  if (!(s.vMin > 0 && s.vMax > s.vMin)) throw new InversionInputError(`velocity bounds must satisfy 0 < vMin < vMax (got ${s.vMin} and ${s.vMax} m/s)`);
  if (!p.shots.length) throw new InversionInputError('there are no picks to invert');
  for (const shot of p.shots) {
    for (let i = 0; i < shot.sigmas.length; i++) {
      if (!(shot.sigmas[i] > 0)) throw new InversionInputError(`shot ${shot.shotId}: pick ${i + 1} has an uncertainty of ${shot.sigmas[i]} s; it must be above 0`);
      if (!Number.isFinite(shot.times[i])) throw new InversionInputError(`shot ${shot.shotId}: pick ${i + 1} has no time`);
    }
  }
}

const nowSeconds = (): number => performance.now() / 1000;

export async function invert(problem: InversionProblem, modeller: ForwardModeller, hooks: InversionHooks = {}): Promise<InversionResult> {
  checkProblem(problem);
  const { grid, active, settings } = problem;
  const n = grid.nx * grid.nz;
  const nodeList: number[] = [];
  const unknownOf = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) if (active[i]) unknownOf[i] = nodeList.push(i) - 1;
  const nodeOf = Int32Array.from(nodeList);
  const nu = nodeOf.length;
  if (!nu) throw new InversionInputError('the model has no ground nodes');
  const stencils = secondDifferenceStencils(grid.nx, grid.nz, unknownOf);
  const obs = observed(problem.shots);
  const sMin = 1 / settings.vMax;
  const sMax = 1 / settings.vMin;
  const clipS = (s: number): number => Math.min(sMax, Math.max(sMin, s));
  const start = new Float64Array(nu);
  for (let j = 0; j < nu; j++) start[j] = clipS(1 / problem.start[nodeOf[j]]);

  const timings: Timings = { forwardSteps: 0, forwardSeconds: 0, matrixSeconds: 0, lsqrSeconds: 0 };
  const forward = async (v: Float32Array): Promise<ForwardResult> => {
    const t0 = nowSeconds();
    const f = await modeller.forward(v);
    timings.forwardSeconds += nowSeconds() - t0;
    timings.forwardSteps++;
    return f;
  };
  const toVelocity = (s: Float64Array): Float32Array => {
    const v = new Float32Array(n).fill(Number.NaN);
    for (let j = 0; j < nu; j++) v[nodeOf[j]] = 1 / s[j];
    return v;
  };

  const resume = hooks.resumeFrom;
  const current = new Float64Array(nu);
  const from = resume ? resume.velocity : problem.start;
  for (let j = 0; j < nu; j++) current[j] = clipS(1 / from[nodeOf[j]]);
  let velocity = resume ? Float32Array.from(resume.velocity, (v, i) => (active[i] ? v : Number.NaN)) : toVelocity(current);
  for (let j = 0; j < nu; j++) current[j] = 1 / velocity[nodeOf[j]];
  let t0 = nowSeconds();
  let F = await forward(velocity);
  let fit = misfit(obs.times, obs.sigmas, F.times);
  if (fit.used === 0) throw new InversionInputError('no pick can be reached by a wave in the starting model');

  const history: IterationRecord[] = resume ? [...resume.history] : [];
  let lambda = resume ? resume.nextSmoothing : settings.smoothing ?? problem.autoSmoothingStart ?? AUTO_SMOOTHING_START;
  let scale = resume ? resume.scale : 0;
  const checkpoint = (): InversionCheckpoint => ({ history: [...history], velocity, nextSmoothing: lambda, scale });
  if (!resume) {
    history.push({ iteration: 0, chi2: fit.chi2, rmsMs: fit.rmsMs, smoothing: null, seconds: nowSeconds() - t0 });
    await hooks.onIteration?.(history[0], checkpoint());
  }

  const fixed = settings.smoothing !== null;
  let stopReason: StopReason = 'iteration-cap';
  let lastLambda = lambda;
  let rejections = 0;
  for (;;) {
    if (fit.chi2 >= TARGET_CHI2.low && fit.chi2 <= TARGET_CHI2.high) {
      stopReason = 'target-misfit';
      break;
    }
    if (history.length - 1 >= settings.maxIterations) {
      stopReason = 'iteration-cap';
      break;
    }
    if (hooks.signal?.aborted) {
      stopReason = 'cancelled';
      break;
    }
    t0 = nowSeconds();

    // Linearised step from the current model.
    const tm = nowSeconds();
    const rows = obs.times.length;
    const weight = new Float64Array(rows);
    const residual = new Float64Array(rows);
    for (let r = 0; r < rows; r++) {
      if (!Number.isFinite(F.times[r])) continue; // unreachable picks sit out this step
      weight[r] = 1 / obs.sigmas[r];
      residual[r] = obs.times[r] - F.times[r];
    }
    const G = new CsrMatrix(rows, n, F.rowPtr, F.cols, F.vals);
    const Gu = toUnknownColumns(G, unknownOf, nu);
    if (!scale) scale = dataScale(Gu, weight, nu);
    const system = buildStep(
      { nx: grid.nx, nz: grid.nz, unknownOf, nodeOf, G, weight, residual, current, start, alphaH: lambda * scale, alphaV: lambda * settings.verticalWeight * scale, mu: settings.damping * scale, smoothFrom: problem.smoothingActsOn === 'departure' ? start : null },
      stencils,
      Gu,
    );
    timings.matrixSeconds += nowSeconds() - tm;
    const tl = nowSeconds();
    const products = modeller.products ? await modeller.products(system.data, system.dataT) : null;
    if (products) system.useProducts(products);
    let solution: ReturnType<typeof lsqr>;
    try {
      solution = lsqr(system.operator, system.rhs, { atol: 1e-4, btol: 1e-4, maxIterations: LSQR_ITERATIONS });
    } finally {
      products?.release();
    }
    timings.lsqrSeconds += nowSeconds() - tl;
    const step = solution.x;
    for (let j = 0; j < nu; j++) step[j] *= system.columnScale[j];

    // Misfit the linearisation predicts for a fraction of the step (for the trust test below).
    const previous = fit.chi2;
    const Gstep = Gu.multiply(step, new Float64Array(rows));
    const predicted = (fraction: number): number => {
      let chi = 0;
      for (let r = 0; r < rows; r++) chi += (weight[r] * (residual[r] - fraction * Gstep[r])) ** 2;
      return chi / fit.used;
    };
    const tryStep = async (fraction: number) => {
      const s = new Float64Array(nu);
      for (let j = 0; j < nu; j++) s[j] = clipS(current[j] + fraction * step[j]);
      const v = toVelocity(s);
      const f = await forward(v);
      return { s, v, f, fit: misfit(obs.times, obs.sigmas, f.times), fraction };
    };
    let trial = await tryStep(1);
    if (trial.fit.chi2 < TARGET_CHI2.low && previous > TARGET_CHI2.high) {
      // Overshot the target: also try the part of the step the linearisation says lands on χ² = 1.
      const part = await tryStep(fractionToTarget(predicted));
      if (Math.abs(Math.log(part.fit.chi2)) < Math.abs(Math.log(trial.fit.chi2)) && part.fit.used >= trial.fit.used) trial = part;
    }
    // A step that makes the misfit worse is shortened (halved, then quartered) before it is given up.
    for (const fraction of [0.5, 0.25]) {
      if (!worse(trial.fit, fit)) break;
      const shorter = await tryStep(fraction);
      if (!worse(shorter.fit, trial.fit)) trial = shorter;
    }
    lastLambda = lambda;
    const rejected = worse(trial.fit, fit);
    if (rejected) {
      rejections++;
      if (!fixed) lambda *= 4; // keep the model, smooth harder
    } else {
      rejections = 0;
      // The state carried on is the stored (Float32) model, so a resumed run continues exactly.
      velocity = trial.v;
      for (let j = 0; j < nu; j++) current[j] = 1 / velocity[nodeOf[j]];
      F = trial.f;
      fit = trial.fit;
      if (!fixed) {
        // Lower λ only when the linearisation held (the misfit fell by at least half of what it
        // predicted); raise it when it failed badly. The trust-region ratio test of Nocedal &
        // Wright 2006, "Numerical Optimization", 2nd ed., Algorithm 4.1.
        // A step that hardly moved the misfit means the smoothing holds the model back: loosen it.
        const gain = (previous - fit.chi2) / Math.max(1e-12, previous - predicted(trial.fraction));
        const slow = (previous - fit.chi2) / previous < STALL_CHANGE;
        if (fit.chi2 < TARGET_CHI2.low) lambda *= 2;
        else if (gain < 0.1 && !slow) lambda *= 2;
        else if (fit.chi2 > TARGET_CHI2.high && (gain >= 0.5 || slow)) lambda = Math.max(AUTO_SMOOTHING_FLOOR, lambda / 2);
      }
    }
    history.push({ iteration: history.length, chi2: fit.chi2, rmsMs: fit.rmsMs, smoothing: lastLambda, seconds: nowSeconds() - t0 });
    await hooks.onIteration?.(history[history.length - 1], checkpoint());

    if (rejected) {
      // No shorter step helps: with a fixed weight nothing will change; with the schedule, give
      // the smoother steps three tries.
      if (fixed || rejections >= 3) {
        stopReason = 'stalled';
        break;
      }
      continue;
    }
    const change = Math.abs(previous - fit.chi2) / previous;
    const atFloor = fixed || lastLambda <= AUTO_SMOOTHING_FLOOR;
    if (change < STALL_CHANGE && atFloor) {
      stopReason = fit.chi2 >= TARGET_CHI2.low && fit.chi2 <= TARGET_CHI2.high ? 'target-misfit' : 'stalled';
      break;
    }
  }

  const { coverage, hits } = rayCoverage(n, F);
  const result: InversionResult = {
    velocity,
    history,
    stopReason,
    coverage,
    hits,
    doi: depthOfInvestigation(F),
    computed: F.times,
    timings,
  };
  if (settings.checkerboard && stopReason !== 'cancelled' && !hooks.signal?.aborted) {
    result.checkerboard = await checkerboardTest(problem, modeller, velocity, coverage, fixed ? settings.smoothing! : lastLambda, hooks.signal);
  }
  return result;
}

/** Smallest step fraction in (0, 1] whose predicted χ² is 1 (bisection; the prediction falls monotonically on [0, 1] here). */
function fractionToTarget(predicted: (f: number) => number): number {
  let lo = 0, hi = 1;
  for (let k = 0; k < 30; k++) {
    const mid = (lo + hi) / 2;
    if (predicted(mid) > 1) lo = mid;
    else hi = mid;
  }
  return Math.max(0.05, hi);
}

const worse = (a: Misfit, b: Misfit): boolean => a.used < b.used || a.chi2 > b.chi2;

/** RMS column norm of the weighted data matrix: turns the dimensionless weights into absolute ones. */
function dataScale(Gu: CsrMatrix, weight: Float64Array, unknowns: number): number {
  let sum = 0;
  for (let r = 0; r < Gu.rows; r++) {
    const w2 = weight[r] * weight[r];
    for (let k = Gu.rowPtr[r]; k < Gu.rowPtr[r + 1]; k++) sum += w2 * Gu.vals[k] * Gu.vals[k];
  }
  return Math.sqrt(sum / unknowns) || 1;
}

/** Nodes whose summed ray length is at least one cell size count as covered for the checkerboard correlation. */
export function coveredThreshold(problem: InversionProblem): number {
  return Math.max(problem.grid.dx, problem.grid.dz);
}

async function checkerboardTest(
  problem: InversionProblem,
  modeller: ForwardModeller,
  final: Float32Array,
  coverage: Float32Array,
  smoothing: number,
  signal?: AbortSignal,
): Promise<CheckerboardResult | undefined> {
  const { grid, active, settings } = problem;
  const size = settings.checkerSize ?? autoCheckerSize(grid);
  const pattern = checkerPattern(grid, active, size, CHECKER_AMPLITUDE);
  const truth = new Float32Array(final.length);
  for (let i = 0; i < final.length; i++) truth[i] = active[i] ? final[i] * (1 + pattern[i]) : final[i];
  const synthetic = await modeller.forward(truth);
  const noise = normalDeviates(0x7f4a7c15);
  let at = 0;
  const shots = problem.shots.map((shot) => {
    const times = new Float64Array(shot.times.length);
    for (let i = 0; i < times.length; i++, at++) {
      const t = synthetic.times[at];
      times[i] = Number.isFinite(t) ? Math.max(0, t + shot.sigmas[i] * noise()) : shot.times[i];
    }
    return { ...shot, times };
  });
  const start = Float32Array.from(final, (v, i) => (active[i] ? v : problem.start[i]));
  const rerun = await invert(
    { ...problem, shots, start, settings: { ...settings, smoothing, checkerboard: false } },
    modeller,
    { signal },
  );
  if (rerun.stopReason === 'cancelled') return undefined;
  const recovered = new Float32Array(final.length).fill(Number.NaN);
  for (let i = 0; i < final.length; i++) if (active[i]) recovered[i] = rerun.velocity[i] / final[i] - 1;
  const threshold = coveredThreshold(problem);
  return {
    size,
    amplitude: CHECKER_AMPLITUDE,
    truePattern: pattern,
    recovered,
    correlation: correlation(pattern, recovered, (i) => coverage[i] >= threshold),
    coverageThreshold: threshold,
  };
}
