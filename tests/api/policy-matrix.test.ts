/**
 * Every API route × every role, against the permission table in ../shared/API.md
 * (written out here by hand, not derived from server/policies, so a change to either is caught).
 * A route without a row here, or without the policy guard as its first handler, fails the test.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiRouters } from '../../server/routes';
import { anonymousAgent, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, freshBorehole, PASSWORD, resetWorld, ROLES, type World, type WorldRole } from './support/world';

type Caller = WorldRole | 'anonymous';
const CALLERS: Caller[] = ['anonymous', ...ROLES];
const SIGNED_IN: Caller[] = [...ROLES];
const MEMBERS_A: Caller[] = ['geophysicist', 'field_tech', 'lead', 'client'];
const STAFF_A: Caller[] = ['geophysicist', 'field_tech', 'lead'];

// "outsider" is a geophysicist of project B only: project A's objects must look absent to them.
const EXPECTED: Record<string, Caller[]> = {
  'GET /api/health': CALLERS,
  'GET /api/auth/csrf': CALLERS,
  'POST /api/auth/login': CALLERS,
  'POST /api/auth/logout': SIGNED_IN,
  'GET /api/auth/me': SIGNED_IN,
  // Issue 17 item 14: who is signed in, if anyone (200 with user null when no one is), for a clean console.
  'GET /api/auth/session': CALLERS,
  // Issue 16: a signed-in user changes their own password.
  'POST /api/auth/password': SIGNED_IN,
  // Issue 17 item 3: an administrator mails a one-time link; anyone holding a valid link sets the password.
  'POST /api/users/:userId/password-reset': ['admin'],
  'POST /api/auth/password-reset': CALLERS,
  'GET /api/users': ['admin'],
  'POST /api/users': ['admin'],
  'GET /api/users/directory': ['admin', 'lead'],
  'PATCH /api/users/:userId': ['admin'],
  'GET /api/projects': SIGNED_IN,
  'POST /api/projects': ['admin', 'lead'],
  'GET /api/projects/:projectId': ['admin', ...MEMBERS_A],
  // Issue 17 item 6: the project's settings (name, status, velocity colour range) are the lead's.
  'PATCH /api/projects/:projectId': ['admin', 'lead'],
  // Issue 19: searching the EPSG list is reference data for any signed-in user.
  'GET /api/crs': SIGNED_IN,
  // Issue 19: a section's exports (DXF, gridded CSV, depth-to-rock CSV and GeoJSON) go to whoever may read the section.
  'GET /api/models/:modelId/export/:file': STAFF_A,
  'GET /api/runs/:runId/export/:file': STAFF_A,
  'GET /api/inversions/:inversionId/export/:file': STAFF_A,
  'GET /api/projects/:projectId/plan': STAFF_A,
  'GET /api/projects/:projectId/plan.dxf': STAFF_A,
  'GET /api/projects/:projectId/plan.geojson': STAFF_A,
  'POST /api/projects/:projectId/members': ['admin', 'lead'],
  'DELETE /api/projects/:projectId/members/:userId': ['admin', 'lead'],
  // Issue 17 item 5: whoever may add and remove members changes a member's role in place.
  'PATCH /api/projects/:projectId/members/:userId': ['admin', 'lead'],
  'POST /api/projects/:projectId/lines': STAFF_A,
  'GET /api/lines/:lineId': STAFF_A,
  'PUT /api/lines/:lineId/stations': ['geophysicist', 'field_tech'],
  // Issue 17 item 4: a replaced station table is kept; whoever reads the line sees the earlier tables, whoever writes stations restores one.
  'GET /api/lines/:lineId/stations/revisions': STAFF_A,
  'POST /api/lines/:lineId/stations/revisions/:number/restore': ['geophysicist', 'field_tech'],
  'POST /api/lines/:lineId/picksets': ['geophysicist', 'field_tech'],
  // Issue 12 item 7: "field technicians and geophysicists upload and pick, leads read, clients never see records".
  'GET /api/lines/:lineId/records': STAFF_A,
  'POST /api/lines/:lineId/records': ['geophysicist', 'field_tech'],
  'GET /api/records/:recordId': STAFF_A,
  'GET /api/records/:recordId/file': STAFF_A,
  'PATCH /api/records/:recordId': ['geophysicist', 'field_tech'],
  'DELETE /api/records/:recordId': ['geophysicist', 'field_tech'],
  'POST /api/lines/:lineId/picksets/from-records': ['geophysicist', 'field_tech'],
  // Issue 13 item 3: boreholes on a line — staff read; field technicians and geophysicists enter, change and delete; never clients.
  'GET /api/lines/:lineId/boreholes': STAFF_A,
  'POST /api/lines/:lineId/boreholes': ['geophysicist', 'field_tech'],
  'POST /api/lines/:lineId/boreholes/file': ['geophysicist', 'field_tech'],
  'PUT /api/boreholes/:boreholeId': ['geophysicist', 'field_tech'],
  'DELETE /api/boreholes/:boreholeId': ['geophysicist', 'field_tech'],
  'POST /api/lines/:lineId/models': ['geophysicist'],
  'GET /api/models/:modelId': STAFF_A,
  'GET /api/models/:modelId/grid': STAFF_A,
  'PUT /api/models/:modelId': ['geophysicist'],
  'POST /api/runs': ['geophysicist', 'lead'],
  'GET /api/runs/:runId': STAFF_A,
  'GET /api/runs/:runId/residuals': STAFF_A,
  'GET /api/runs/:runId/fields/:shotId': STAFF_A,
  'GET /api/runs/:runId/rays': STAFF_A,
  'POST /api/runs/:runId/cancel': ['geophysicist', 'lead'],
  'POST /api/runs/:runId/reports': ['geophysicist', 'lead'],
  // Issue 11 item 7: geophysicists start and save inversions; leads and field technicians read them;
  // cancelling is allowed to whoever may cancel a run (geophysicist, lead), as item 3 says "cancel works as for runs".
  'POST /api/inversions': ['geophysicist'],
  'GET /api/lines/:lineId/inversions': STAFF_A,
  'GET /api/inversions/:inversionId': STAFF_A,
  'GET /api/inversions/:inversionId/section': STAFF_A,
  'GET /api/inversions/:inversionId/residuals': STAFF_A,
  'POST /api/inversions/:inversionId/cancel': ['geophysicist', 'lead'],
  'POST /api/inversions/:inversionId/model': ['geophysicist'],
  // Issue 20 item 5: ensembles as inversions (geophysicists start, leads may cancel, staff read);
  // clients see the bands only in a shared report.
  'POST /api/inversions/:inversionId/ensembles': ['geophysicist'],
  'GET /api/inversions/:inversionId/ensembles': STAFF_A,
  'GET /api/ensembles/:ensembleId': STAFF_A,
  'GET /api/ensembles/:ensembleId/members': STAFF_A,
  'GET /api/ensembles/:ensembleId/section': STAFF_A,
  'POST /api/ensembles/:ensembleId/cancel': ['geophysicist', 'lead'],
  // Issue 11 item 7: leads report (as from runs); geophysicists make the report they submit.
  'POST /api/inversions/:inversionId/reports': ['geophysicist', 'lead'],
  // A draft: the project's client may not read it yet (tests/api/reports.test.ts covers a shared one).
  'GET /api/reports/:reportId': STAFF_A,
  'GET /api/reports/:reportId/pdf': STAFF_A,
  // Issue 19: a report's CAD/GIS files, as its PDF (clients once it is shared; report A is a draft).
  'GET /api/reports/:reportId/export/:file': STAFF_A,
  'POST /api/reports/:reportId/submit': ['geophysicist'],
  'POST /api/reports/:reportId/approve': ['lead'],
  'POST /api/reports/:reportId/return': ['lead'],
  'POST /api/reports/:reportId/share': ['lead'],
  'GET /api/projects/:projectId/reports': MEMBERS_A,
  'GET /api/projects/:projectId/audit': ['admin', 'lead'],
  'GET /api/outbox': ['admin'],
  // Issue 16: administrators write the organisation setting; it prints on every report, so any signed-in account may read it.
  'GET /api/organisation': SIGNED_IN,
  'PUT /api/organisation': ['admin'],
  'GET /api/organisation/logo': SIGNED_IN,
  'PUT /api/organisation/logo': ['admin'],
  'GET /api/picksets/:pickSetId': STAFF_A,
  'POST /api/picksets/:pickSetId/revisions': ['geophysicist'],
  'GET /api/picksets/:pickSetId/file': STAFF_A,
  // Issue 17 item 5: the uploaders (geophysicist, field technician) retire a mistaken pick set and reinstate it.
  'POST /api/picksets/:pickSetId/retire': ['geophysicist', 'field_tech'],
  'POST /api/picksets/:pickSetId/reinstate': ['geophysicist', 'field_tech'],
};

interface RouteInfo {
  key: string;
  method: string;
  path: string;
  guarded: boolean;
}

function listRoutes(t: TestApp): RouteInfo[] {
  const out: RouteInfo[] = [];
  for (const router of apiRouters(t.redis, t.queue, t.mailer)) {
    for (const layer of router.stack as { route?: { path: string; methods: Record<string, boolean>; stack: { handle: { policyAction?: string } }[] } }[]) {
      if (!layer.route) continue;
      for (const method of Object.keys(layer.route.methods)) {
        const m = method.toUpperCase();
        const path = `/api${layer.route.path}`;
        out.push({ key: `${m} ${path}`, method: m, path, guarded: typeof layer.route.stack[0]?.handle.policyAction === 'string' });
      }
    }
  }
  return out;
}

/** Real ids from project A, so a refusal cannot be mistaken for a missing object. */
function concretePath(path: string, w: World): string {
  return path
    .replace(':projectId', w.projectA.id)
    .replace(':lineId', w.lineA.id)
    .replace(':pickSetId', w.pickSetA)
    .replace(':modelId', w.modelA)
    .replace(':runId', w.runA)
    .replace(':reportId', w.reportA)
    .replace(':inversionId', w.inversionA)
    .replace(':ensembleId', w.ensembleA)
    .replace(':recordId', w.recordA)
    .replace(':boreholeId', w.boreholeA)
    .replace(':shotId', 'F')
    .replace(':number', '999')
    .replace(':file', 'section.csv')
    .replace(':userId', w.loner.id);
}

/**
 * Request bodies. Empty by default, so an allowed mutation stops at validation (400) and changes
 * nothing; a route whose project is named in the body gets a real object with an invalid field.
 */
function bodyFor(key: string, w: World): object {
  if (key === 'POST /api/runs') return { modelId: w.modelA, pickSetId: w.pickSetA, order: 3 };
  if (key === 'POST /api/inversions') return { pickSetId: w.pickSetA, start: { kind: 'gradient' }, settings: { vMin: 5000, vMax: 100 } };
  if (key === 'POST /api/inversions/:inversionId/ensembles') return { members: 1 };
  if (/^POST \/api\/reports\/:reportId\//.test(key)) return { comment: 42 }; // not a string: 400 before any step
  if (key === 'POST /api/runs/:runId/reports' || key === 'POST /api/inversions/:inversionId/reports') return { isoVelocity: -1 };
  return {};
}

/** Refusals by the policy layer; anything else (200, 204, 400, 404 member_not_found, 409 …) means the call got through. */
const isRefusal = (status: number, error: unknown) =>
  (status === 401 && error === 'not_signed_in') || (status === 403 && error === 'forbidden') || (status === 404 && error === 'not_found');

describe('route × role permission matrix', () => {
  let t: TestApp;
  let world: World;
  const agents = new Map<Caller, Agent>();

  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    agents.set('anonymous', await anonymousAgent(t.app));
    for (const role of ROLES) agents.set(role, await signedInAgent(t.app, emailOf(role), PASSWORD));
  });
  afterAll(async () => t?.close());

  it('every API route has a row in the expected table and a policy guard first', () => {
    const routes = listRoutes(t);
    expect(routes.map((r) => r.key).sort()).toEqual(Object.keys(EXPECTED).sort());
    expect(routes.filter((r) => !r.guarded).map((r) => r.key)).toEqual([]);
  });

  it('each role reaches exactly the routes the table allows', async () => {
    // Sign-out ends the session, so it runs last for every caller.
    const routes = listRoutes(t).sort((a, b) => Number(a.key === 'POST /api/auth/logout') - Number(b.key === 'POST /api/auth/logout'));
    const actual: Record<string, Caller[]> = {};
    for (const route of routes) {
      actual[route.key] = [];
      for (const caller of CALLERS) {
        const agent = agents.get(caller)!;
        // A DELETE that gets through removes its hole: each caller gets a hole of its own.
        const path = route.key === 'DELETE /api/boreholes/:boreholeId' ? `/api/boreholes/${await freshBorehole(world)}` : concretePath(route.path, world);
        const req = agent[route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](path).set('X-CSRF-Token', agent.csrf);
        const res = route.method === 'GET' ? await req : await req.send(bodyFor(route.key, world));
        // /api/health answers 503 when a service is down (no worker runs in this suite); anything else must not fail.
        if (route.key !== 'GET /api/health') expect(res.status, `${caller} ${route.key}`).toBeLessThan(500);
        if (!isRefusal(res.status, res.body?.error)) actual[route.key].push(caller);
      }
    }
    expect(actual).toEqual(EXPECTED);
  });
});
