/**
 * Canned inversion answers for the pages' end-to-end test, until the server routes of issue 11 are
 * merged: they follow the view types in shared/schemas/inversions.ts (checked by tsc here) and the
 * contract the issue states. The start body is checked with the server's own zod schema, so what the
 * form sends is what the real route accepts. The section is an invented smooth gradient under the
 * demo line's ground, with ray coverage falling with depth and no rays below a DOI line.
 */
import { readFileSync } from 'node:fs';
import type { BrowserContext, Route } from 'playwright-core';
import { evalPolyline } from '../../../shared/model/polyline';
import { startInversionBody, type InversionSectionView, type InversionView, type StartInversionBody } from '../../../shared/schemas/inversions';
import type { ResidualRow, RunDetail } from '../../../src/api/types';

const STATIONS = readFileSync('fixtures/demo/tq-l1.stations.csv', 'utf8')
  .split('\n')
  .filter((l) => /^\d/.test(l))
  .map((l) => l.split(','))
  .map(([station, x, z]) => ({ station: station!, x: Number(x), z: Number(z) }));
const PICKS = readFileSync('fixtures/demo/tq-l1.picks.csv', 'utf8')
  .split('\n')
  .filter((l) => /^S\d/.test(l))
  .map((l) => l.split(','));

const SURFACE: [number, number][] = STATIONS.map((s) => [s.x, s.z]);
const SHOTS = [...new Map(PICKS.map((p) => [p[0]!, Number(p[1])])).entries()].map(([shotId, x]) => ({ shotId, x, z: evalPolyline(SURFACE, Math.min(Math.max(x, SURFACE[0]![0]), SURFACE.at(-1)![0])) }));

/** A section on the demo line: v = base + gradient·depth with a faster ridge, coverage falling with depth. */
export function cannedSection(base: number, gradient: number, checkerboard: boolean): InversionSectionView {
  const grid = { x0: -12.5, dx: 1.25, nx: 117, z0: 102.5, dz: 1.25, nz: 25 };
  const velocity: (number | null)[] = [];
  const coverage: (number | null)[] = [];
  const hits: (number | null)[] = [];
  const truePattern: (number | null)[] = [];
  const recovered: (number | null)[] = [];
  const doi: (number | null)[] = [];
  for (let ix = 0; ix < grid.nx; ix++) {
    const x = grid.x0 + ix * grid.dx;
    doi.push(x < -5 || x > 125 ? null : evalPolyline(SURFACE, Math.min(Math.max(x, 0), 120)) - 14 - 3 * Math.sin(x / 20));
  }
  for (let iz = 0; iz < grid.nz; iz++) {
    for (let ix = 0; ix < grid.nx; ix++) {
      const x = grid.x0 + ix * grid.dx;
      const z = grid.z0 - iz * grid.dz;
      const ground = evalPolyline(SURFACE, Math.min(Math.max(x, 0), 120));
      const depth = ground - z;
      if (depth < 0) {
        for (const a of [velocity, coverage, hits, truePattern, recovered]) a.push(null);
        continue;
      }
      const ridge = 600 * Math.exp(-(((x - 70) / 18) ** 2)) * Math.min(1, depth / 8);
      velocity.push(Math.round(Math.min(4200, base + gradient * depth + ridge)));
      const d = doi[ix];
      const cov = d === null || z < d ? 0 : Math.round(40 * Math.exp(-depth / 4) * 100) / 100;
      coverage.push(cov);
      hits.push(Math.round(cov * 3));
      const sign = (Math.floor(x / 10) + Math.floor(depth / 10)) % 2 === 0 ? 1 : -1;
      truePattern.push(0.07 * sign);
      recovered.push(Math.round(0.07 * sign * Math.exp(-depth / 9) * 1e4) / 1e4);
    }
  }
  return {
    grid,
    surface: SURFACE,
    velocity,
    coverage,
    hits,
    doi,
    checkerboard: checkerboard ? { size: 10, amplitude: 0.07, correlation: 0.71, coverageThreshold: 1, truePattern, recovered } : null,
    shots: SHOTS,
    stations: STATIONS,
  };
}

/** One row per demo pick, with small invented residuals (σ 0.5 ms). */
export function cannedResiduals(scale: number): ResidualRow[] {
  return PICKS.map((p, i) => {
    const observedMs = Number(p[5]);
    const residualMs = Math.round(scale * 0.5 * Math.sin(i * 1.7) * 1000) / 1000;
    return {
      pickIndex: i,
      shotId: p[0]!,
      receiverX: Number(p[3]),
      receiverZ: evalPolyline(SURFACE, Number(p[3])),
      observedMs,
      computedMs: Math.round((observedMs - residualMs) * 1000) / 1000,
      residualMs,
      normalised: residualMs / 0.5,
      sigmaMs: 0.5,
      excluded: false,
      flags: [],
    };
  });
}

const HISTORY = [
  { iteration: 0, chi2: 38.2, rmsMs: 3.09, smoothing: null },
  { iteration: 1, chi2: 9.4, rmsMs: 1.53, smoothing: 40 },
  { iteration: 2, chi2: 3.1, rmsMs: 0.88, smoothing: 20 },
  { iteration: 3, chi2: 1.62, rmsMs: 0.64, smoothing: 10 },
  { iteration: 4, chi2: 1.19, rmsMs: 0.55, smoothing: 5 },
  { iteration: 5, chi2: 1.04, rmsMs: 0.51, smoothing: 2.5 },
];

interface Stored {
  view: InversionView;
  /** GETs answered so far: a started inversion moves on by one iteration per GET. */
  polls: number;
  /** Stays running until cancelled (for the cancel check). */
  hold: boolean;
  section: InversionSectionView;
  residuals: ResidualRow[];
}

export interface InversionStub {
  posts: StartInversionBody[];
  inversions: Map<string, Stored>;
  /** Add a finished inversion directly (for the comparison). */
  addDone(label: string, base: number, gradient: number): string;
  /** Add an inversion that stays running until cancelled. */
  addRunning(label: string): string;
  /** A finished forward run of the demo model (only GET /api/runs/:id and its residuals are canned). */
  addRun(modelId: string, pickSetId: string): string;
}

let counter = 0;
const newId = () => `7e0c${(++counter).toString(16).padStart(4, '0')}-1a2b-4c3d-8e4f-5a6b7c8d9e0f`;

function viewOf(lineId: string, body: StartInversionBody, label: string): InversionView {
  const now = new Date().toISOString();
  return {
    id: newId(),
    lineId,
    label,
    status: 'queued',
    pickSetId: body.pickSetId,
    pickSetRevision: body.pickSetRevision ?? 0,
    start: body.start.kind === 'gradient' ? { kind: 'gradient', spacing: body.start.spacing ?? 1, v0: null, k: null } : { kind: 'model', modelId: body.start.modelId, modelVersion: 1 },
    grid: { x0: -12.5, dx: 1.25, nx: 117, z0: 102.5, dz: 1.25, nz: 25 },
    settings: body.settings,
    history: [],
    progress: { iteration: 0, maxIterations: body.settings.maxIterations },
    stats: null,
    savedModelId: null,
    createdAt: now,
    startedAt: null,
    finishedAt: null,
  };
}

function advance(s: Stored): void {
  const v = s.view;
  if (v.status === 'done' || v.status === 'cancelled' || v.status === 'failed') return;
  s.polls++;
  if (s.polls < 2) return; // the first answer: still queued
  v.status = 'running';
  v.startedAt ??= new Date().toISOString();
  if (v.start.kind === 'gradient') v.start = { ...v.start, v0: 412, k: 38.5 };
  const n = Math.min(HISTORY.length, s.polls - 1);
  v.history = HISTORY.slice(0, n);
  v.progress = { iteration: n - 1, maxIterations: v.settings.maxIterations };
  if (n === HISTORY.length && !s.hold) finish(s);
}

function finish(s: Stored): void {
  const v = s.view;
  v.status = 'done';
  v.history = HISTORY;
  v.progress = { iteration: HISTORY.length - 1, maxIterations: v.settings.maxIterations };
  v.finishedAt = new Date().toISOString();
  v.startedAt ??= v.createdAt;
  v.stats = {
    chi2: 1.04,
    rms_ms: 0.51,
    picks: PICKS.length,
    shots: SHOTS.length,
    iterations: HISTORY.length - 1,
    stopReason: 'target-misfit',
    checkerboardCorrelation: v.settings.checkerboard ? 0.71 : null,
    timings: { forward: 6.1, matrix: 0.8, lsqr: 1.4, total: 8.6 },
  };
}

const json = (route: Route, status: number, body: unknown) => route.fulfill({ status, contentType: 'application/json', body: JSON.stringify(body) });

/** Answer the inversion routes in this browser context; everything else goes to the real app. */
export async function stubInversions(context: BrowserContext, lineId: string, savedModelId: string): Promise<InversionStub> {
  const inversions = new Map<string, Stored>();
  const runs = new Map<string, RunDetail>();
  const posts: StartInversionBody[] = [];
  const stub: InversionStub = {
    posts,
    inversions,
    addDone(label, base, gradient) {
      const view = viewOf(lineId, startInversionBody.parse({ pickSetId: 'a1b2c3d4-e5f6-4a7b-8c9d-0e1f2a3b4c5d', start: { kind: 'gradient' }, label }), label);
      const s: Stored = { view, polls: 0, hold: false, section: cannedSection(base, gradient, false), residuals: cannedResiduals(1.3) };
      finish(s);
      inversions.set(view.id, s);
      return view.id;
    },
    addRunning(label) {
      const view = viewOf(lineId, startInversionBody.parse({ pickSetId: 'a1b2c3d4-e5f6-4a7b-8c9d-0e1f2a3b4c5d', start: { kind: 'gradient' }, label }), label);
      inversions.set(view.id, { view, polls: 1, hold: true, section: cannedSection(380, 95, false), residuals: cannedResiduals(1) });
      return view.id;
    },
    addRun(modelId, pickSetId) {
      const id = newId();
      const now = new Date().toISOString();
      runs.set(id, {
        id,
        lineId,
        modelId,
        pickSetId,
        pickSetRevision: 0,
        order: 2,
        status: 'done',
        progress: { done: SHOTS.length, total: SHOTS.length, fraction: 1 },
        stats: { rms_ms: 0.62, chi2: 1.5, max_abs_residual_ms: 1.9, mean_residual_ms: 0.02, shots: SHOTS.length, picks: PICKS.length, excluded: 0, solve_seconds: 1.2, active_nodes: 40000, by_shot: [], by_receiver: [] },
        createdAt: now,
        startedAt: now,
        finishedAt: now,
      });
      return id;
    },
  };

  await context.route(/\/api\/runs\/7e0c[^/]*(\/residuals)?$/, async (route) => {
    const m = /\/api\/runs\/([^/]+)(\/residuals)?$/.exec(new URL(route.request().url()).pathname)!;
    const run = runs.get(m[1]!);
    if (!run) return json(route, 404, { error: 'not_found', message: 'No such run.' });
    return json(route, 200, m[2] ? cannedResiduals(1.7) : run);
  });

  await context.route(/\/api\/(inversions|lines\/[^/]+\/inversions)(\/|$|\?)/, async (route) => {
    const req = route.request();
    const path = new URL(req.url()).pathname;
    if (req.method() === 'GET' && /^\/api\/lines\/[^/]+\/inversions$/.test(path)) {
      for (const s of inversions.values()) if (s.view.status === 'queued' || s.view.status === 'running') advance(s);
      return json(route, 200, [...inversions.values()].map((s) => s.view).reverse());
    }
    if (req.method() === 'POST' && path === '/api/inversions') {
      const parsed = startInversionBody.safeParse(req.postDataJSON());
      if (!parsed.success) return json(route, 400, { error: 'validation_failed', message: 'The request is not valid.', issues: parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message })) });
      posts.push(parsed.data);
      // A refusal the form cannot foresee (the real server decides it from the picks): strong damping.
      if (parsed.data.settings.damping > 50) {
        return json(route, 422, { error: 'validation_failed', message: 'These settings cannot be used with this pick set.', issues: [{ path: 'settings.damping', message: 'damping this strong would keep the starting model unchanged' }] });
      }
      const view = viewOf(lineId, parsed.data, parsed.data.label);
      inversions.set(view.id, { view, polls: 0, hold: parsed.data.label.includes('hold'), section: cannedSection(380, 95, parsed.data.settings.checkerboard), residuals: cannedResiduals(1) });
      return json(route, 202, { id: view.id, status: view.status });
    }
    const m = /^\/api\/inversions\/([^/]+)(\/[a-z]+)?$/.exec(path);
    const s = m ? inversions.get(m[1]!) : undefined;
    if (!m || !s) return json(route, 404, { error: 'not_found', message: 'We could not find that inversion.' });
    const tail = m[2] ?? '';
    if (req.method() === 'GET' && tail === '') {
      advance(s);
      return json(route, 200, s.view);
    }
    if (req.method() === 'GET' && tail === '/section') return s.view.status === 'done' ? json(route, 200, s.section) : json(route, 409, { error: 'not_done', message: 'The inversion has not finished.' });
    if (req.method() === 'GET' && tail === '/residuals') return json(route, 200, s.residuals);
    if (req.method() === 'POST' && tail === '/cancel') {
      if (s.view.status !== 'queued' && s.view.status !== 'running') return json(route, 409, { error: 'not_active', message: 'It has already stopped.' });
      s.view.status = 'cancelled';
      s.view.finishedAt = new Date().toISOString();
      return json(route, 200, s.view);
    }
    if (req.method() === 'POST' && tail === '/model') {
      s.view.savedModelId = savedModelId;
      return json(route, 201, { id: savedModelId, version: 2 });
    }
    return json(route, 405, { error: 'method_not_allowed', message: 'Not here.' });
  });
  return stub;
}

