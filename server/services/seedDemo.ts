import { readFileSync } from 'node:fs';
import type { Queue } from 'bullmq';
import type { DataSource } from 'typeorm';
import { startInversionBody } from '../../shared/schemas/inversions';
import { parseStationCsv } from '../../shared/stations';
import { demoConsultancy, demoLine, demoProject, demoUsers, DEMO_PASSWORD } from '../../fixtures/demo/scenario';
import { hashPassword } from '../auth/password';
import { Inversion, PickSet, Project, ProjectMember, Station, SurveyLine, User, VelocityModel } from '../entities';
import { parseBoreholeCsv } from '../../shared/boreholes';
import { parsePickText } from '../../shared/picks';
import { createBoreholesFromFile } from './boreholes';
import { demoRecordFiles } from './demoRecords';
import { importPicks } from './importPicks';
import { storeRecord } from './records';
import { startInversion } from './inversions';
import { saveModelVersion } from './models';
import { replaceStations } from './stations';

const DEMO_FILES = 'fixtures/demo';

/** An invented postal address for the invented consultancy (no real place). */
const DEMO_CONSULTANCY_ADDRESS = '4 Quarry Lane, Cobbleford, Westmarch (fictional)';

/** Creates the demo accounts, project, memberships and line when absent. Safe to run again. */
export async function seedDemo(ds: DataSource): Promise<{ created: number }> {
  let created = 0;
  await ds.transaction(async (em) => {
    let project = await em.findOneBy(Project, { name: demoProject.name });
    if (!project) {
      project = await em.save(em.create(Project, demoProject));
      created++;
    }
    for (const u of demoUsers) {
      let user = await em.findOneBy(User, { email: u.email });
      if (!user) {
        const passwordHash = await hashPassword(DEMO_PASSWORD);
        user = await em.save(em.create(User, { email: u.email, name: u.name, globalRole: u.globalRole, passwordHash, active: true }));
        created++;
      }
      if (u.projectRole && !(await em.existsBy(ProjectMember, { projectId: project.id, userId: user.id }))) {
        await em.insert(ProjectMember, { projectId: project.id, userId: user.id, role: u.projectRole });
        created++;
      }
    }
    // The invented consultancy goes into the organisation setting, unless an administrator has set one.
    const [org] = await em.query(
      `INSERT INTO organisation (id, name, address) VALUES (1, $1, $2) ON CONFLICT (id) DO NOTHING RETURNING id`,
      [demoConsultancy, DEMO_CONSULTANCY_ADDRESS],
    );
    if (org) created++;
    if (!(await em.existsBy(SurveyLine, { projectId: project.id, name: demoLine.name }))) {
      await em.save(em.create(SurveyLine, { projectId: project.id, ...demoLine }));
      created++;
    }
  });
  created += await seedDemoFieldData(ds);
  return { created };
}

/** Stations, the pick file and a first velocity model of the demo line (made by scripts/demo/generate-tq-l1.ts), when the line has none. */
async function seedDemoFieldData(ds: DataSource): Promise<number> {
  const project = await ds.getRepository(Project).findOneByOrFail({ name: demoProject.name });
  const line = await ds.getRepository(SurveyLine).findOneByOrFail({ projectId: project.id, name: demoLine.name });
  const tech = await ds.getRepository(User).findOneByOrFail({ email: 'tech@timefield.test' });
  let created = 0;
  if (!(await ds.getRepository(Station).existsBy({ lineId: line.id }))) {
    const parsed = parseStationCsv(readFileSync(`${DEMO_FILES}/tq-l1.stations.csv`, 'utf8'));
    if (!parsed.ok) throw new Error(`demo stations are invalid: ${JSON.stringify(parsed.issues)}`);
    await replaceStations(tech.id, project.id, line.id, parsed.stations);
    created += parsed.stations.length;
  }
  if (!(await ds.getRepository(PickSet).existsBy({ lineId: line.id }))) {
    const { picks } = await importPicks(tech.id, project.id, line.id, 'tq-l1.picks.csv', readFileSync(`${DEMO_FILES}/tq-l1.picks.csv`));
    created += picks;
  }
  if (!(await ds.getRepository(VelocityModel).existsBy({ lineId: line.id }))) {
    const geo = await ds.getRepository(User).findOneByOrFail({ email: 'geo@timefield.test' });
    const model = JSON.parse(readFileSync(`${DEMO_FILES}/tq-l1.model.json`, 'utf8'));
    await saveModelVersion(geo.id, project.id, line.id, model, { name: 'main', comment: 'Starting model from the first-break interpretation', basedOn: null });
    created++;
  }
  if (!(await ds.query('SELECT 1 FROM records WHERE line_id = $1 LIMIT 1', [line.id])).length) created += await seedDemoRecords(tech.id, project.id, line.id);
  if (!(await ds.query('SELECT 1 FROM boreholes WHERE line_id = $1 LIMIT 1', [line.id])).length) {
    const holes = parseBoreholeCsv(readFileSync(`${DEMO_FILES}/tq-l1.boreholes.csv`, 'utf8'));
    if (!holes.ok) throw new Error(`demo boreholes are invalid: ${JSON.stringify(holes.issues)}`);
    created += (await createBoreholesFromFile(tech.id, project.id, line.id, 'tq-l1.boreholes.csv', holes.boreholes)).length;
  }
  return created;
}

/** One SEG-2 file per shot of the demo picks, made from the demo model (server/services/demoRecords.ts). */
async function seedDemoRecords(actorId: string, projectId: string, lineId: string): Promise<number> {
  const stations = parseStationCsv(readFileSync(`${DEMO_FILES}/tq-l1.stations.csv`, 'utf8'));
  const picks = parsePickText(readFileSync(`${DEMO_FILES}/tq-l1.picks.csv`, 'utf8'));
  if (!stations.ok || !picks.ok) throw new Error('demo stations or picks are invalid');
  const shots = [...new Map(picks.picks.map((p) => [p.shotId, { shotId: p.shotId, x: p.sourceX }])).values()];
  const model = JSON.parse(readFileSync(`${DEMO_FILES}/tq-l1.model.json`, 'utf8'));
  const files = demoRecordFiles(model, stations.stations, shots, '14/OCT/2026');
  for (const f of files) await storeRecord(actorId, projectId, lineId, f.fileName, Buffer.from(f.bytes));
  return files.length;
}

/**
 * The demo line's inversion from the automatic start (issue 11 item 8), queued when the line has
 * none; the worker that `npm start` runs next makes it, as it makes any other. True when one was queued.
 */
export async function seedDemoInversion(ds: DataSource, queue: Queue): Promise<boolean> {
  const project = await ds.getRepository(Project).findOneByOrFail({ name: demoProject.name });
  const line = await ds.getRepository(SurveyLine).findOneByOrFail({ projectId: project.id, name: demoLine.name });
  if (await ds.getRepository(Inversion).existsBy({ lineId: line.id })) return false;
  const pickSet = await ds.getRepository(PickSet).findOneOrFail({ where: { lineId: line.id }, order: { createdAt: 'ASC' } });
  const geo = await ds.getRepository(User).findOneByOrFail({ email: 'geo@timefield.test' });
  const body = startInversionBody.parse({ pickSetId: pickSet.id, start: { kind: 'gradient' }, label: 'Automatic start' });
  await startInversion(geo.id, project.id, body, queue);
  return true;
}
