import { dataSource } from '../../../server/db/dataSource';
import { hashPassword } from '../../../server/auth/password';
import { Inversion, Project, ProjectMember, Report, Run, SurveyLine, User } from '../../../server/entities';
import { DEFAULT_INVERSION_SETTINGS } from '../../../shared/schemas/inversions';
import type { ProjectRole } from '../../../shared/schemas/projects';
import { importPicks } from '../../../server/services/importPicks';
import { saveModelVersion } from '../../../server/services/models';
import { writeSeg2 } from '../../../shared/records';
import { createBorehole } from '../../../server/services/boreholes';
import { storeRecord } from '../../../server/services/records';

export const PASSWORD = 'test-password-123';

/** The people of the test world: one per project role on project A, an admin, and an outsider on project B. */
export const ROLES = ['admin', 'geophysicist', 'field_tech', 'lead', 'client', 'outsider'] as const;
export type WorldRole = (typeof ROLES)[number];

export interface World {
  users: Record<WorldRole, User>;
  projectA: Project;
  projectB: Project;
  lineA: SurveyLine;
  lineB: SurveyLine;
  /** A small pick set on line A: two end-to-end shots over 600 m/s ground. */
  pickSetA: string;
  /** Version 1 of model "main" on line A: 600 m/s homogeneous, 25 m × 10 m at 0.5 m. */
  modelA: string;
  /** A finished run row of model A against pick set A (no results stored). */
  runA: string;
  /** A draft report of run A (no PDF yet). */
  reportA: string;
  /** A small SEG-2 record of shot F on line A (worldRecord()). */
  recordA: string;
  boreholeA: string;
  /** A finished inversion row of pick set A (no iterations or result stored). */
  inversionA: string;
  ensembleA: string;
  /** An active account that belongs to no project. */
  loner: User;
}

export const emailOf = (role: WorldRole | 'loner') => `${role}@world.test`;

/** Empties every table and builds the world again; each test file starts from here. */
export async function resetWorld(): Promise<World> {
  const tables = await dataSource.query(`SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'migrations'`);
  await dataSource.query(`TRUNCATE ${tables.map((t: { tablename: string }) => `"${t.tablename}"`).join(', ')} RESTART IDENTITY CASCADE`);
  const passwordHash = await hashPassword(PASSWORD);
  const users = {} as Record<WorldRole, User>;
  const repo = dataSource.getRepository(User);
  for (const role of ROLES) {
    users[role] = await repo.save(repo.create({ email: emailOf(role), name: `Test ${role}`, passwordHash, globalRole: role === 'admin' ? 'admin' : null }));
  }
  const loner = await repo.save(repo.create({ email: emailOf('loner'), name: 'Test loner', passwordHash, globalRole: null }));
  const projects = dataSource.getRepository(Project);
  const projectA = await projects.save(projects.create({ name: 'Project A', site: 'Site A', clientOrganisation: 'Client A' }));
  const projectB = await projects.save(projects.create({ name: 'Project B', site: 'Site B', clientOrganisation: 'Client B' }));
  const members = dataSource.getRepository(ProjectMember);
  for (const role of ['geophysicist', 'field_tech', 'lead', 'client'] as ProjectRole[]) {
    await members.insert({ projectId: projectA.id, userId: users[role as WorldRole].id, role });
  }
  await members.insert({ projectId: projectB.id, userId: users.outsider.id, role: 'geophysicist' });
  const lines = dataSource.getRepository(SurveyLine);
  const lineA = await lines.save(lines.create({ projectId: projectA.id, name: 'A-1' }));
  const lineB = await lines.save(lines.create({ projectId: projectB.id, name: 'B-1' }));
  const { id: pickSetA } = await importPicks(users.field_tech.id, projectA.id, lineA.id, 'world.picks.csv', Buffer.from(WORLD_PICKS));
  const { id: modelA } = await saveModelVersion(users.geophysicist.id, projectA.id, lineA.id, WORLD_MODEL, { name: 'main', comment: '', basedOn: null });
  const runs = dataSource.getRepository(Run);
  const runA = (await runs.save(runs.create({ lineId: lineA.id, modelId: modelA, pickSetId: pickSetA, pickSetRevision: 0, order: 2, status: 'done', shotsTotal: 2, shotsDone: 2 }))).id;
  const reports = dataSource.getRepository(Report);
  const reportA = (await reports.save(reports.create({ runId: runA, projectId: projectA.id, status: 'draft', renderState: 'queued', options: { shotId: 'F', isoVelocity: 2500, acquisitionNotes: '' }, createdBy: users.geophysicist.id }))).id;
  const inversions = dataSource.getRepository(Inversion);
  const inversionA = (await inversions.save(inversions.create({
    lineId: lineA.id, pickSetId: pickSetA, pickSetRevision: 0, startKind: 'gradient', startSpacing: 2.5, grid: WORLD_MODEL.grid, surface: null,
    settings: DEFAULT_INVERSION_SETTINGS, status: 'done', shots: 2, picks: 10, createdBy: users.geophysicist.id,
  }))).id;
  // Finished, so a cancel that gets through answers 409 and changes nothing.
  const [{ id: ensembleA }] = await dataSource.query(
    `INSERT INTO ensembles (inversion_id, line_id, members, seed, variation, rock_velocity_min, rock_velocity_max, coverage_threshold, status)
     VALUES ($1, $2, 2, 1, '{"start":true,"smoothing":true,"picks":"sigma"}', 2500, 2500, 1, 'done') RETURNING id`,
    [inversionA, lineA.id],
  );
  const recordA = (await storeRecord(users.field_tech.id, projectA.id, lineA.id, 'F.sg2', Buffer.from(worldRecord()))).id;
  // Linked to the pick set, so a DELETE of it (the route × role walk) is refused and changes nothing.
  await dataSource.query('INSERT INTO pick_set_records (pick_set_id, record_id) VALUES ($1, $2)', [pickSetA, recordA]);
  const boreholeA = await freshBorehole({ users, projectA, lineA });
  return { users, projectA, projectB, lineA, lineB, pickSetA, modelA, runA, reportA, inversionA, ensembleA, recordA, boreholeA, loner };
}

/** Direct-wave times t = x / 600 m/s in ms, forward and reverse shots (invented test data). */
export const WORLD_PICKS = [
  'shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms',
  ...[0, 6, 12, 18, 24].map((x) => `F,0,,${x},,${((x / 600) * 1000).toFixed(3)},0.5`),
  ...[0, 6, 12, 18, 24].map((x) => `R,24,,${x},,${(((24 - x) / 600) * 1000).toFixed(3)},0.5`),
].join('\n');

/** Homogeneous 600 m/s ground covering the world's pick set (invented test data). */
export const WORLD_MODEL = {
  format: 'timefield-model/1',
  grid: { x0: 0, dx: 0.5, nx: 51, z0: 0, dz: 0.5, nz: 21 },
  layers: [{ name: 'ground', v_top: 600, v_base: 600 }],
};

/** Shot F of the world as a SEG-2 record: five traces (0–24 m), a spike at each direct-wave time (invented test data). */
export function worldRecord(): Uint8Array {
  return writeSeg2([0, 6, 12, 18, 24].map((x, i) => {
    const samples = new Float32Array(200);
    samples[Math.round(((x / 600) * 1000) / 0.25)] = 1;
    return { samples, channel: i + 1, sampleInterval: 0.00025, receiver: { x, y: null, z: null }, source: { x: 0, y: null, z: null } };
  }));
}


let holes = 0;
/** A new borehole on line A (the route × role walk deletes one per allowed caller). */
export async function freshBorehole(w: Pick<World, 'users' | 'projectA' | 'lineA'>): Promise<string> {
  const body = { name: `BH${++holes}`, kind: 'borehole' as const, x: 5, groundZ: null, waterDepth: null, contacts: [{ depth: 3, material: 'rock', rockTop: true }], note: '' };
  return (await createBorehole(w.users.field_tech.id, w.projectA.id, w.lineA.id, body)).id;
}
