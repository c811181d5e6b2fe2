/**
 * Boreholes and trial pits on a line (issue 13 item 3): entered by form or a CSV file (parsed by
 * shared/boreholes; a file with any problem is refused whole), each write in one transaction with
 * an audit entry. The ground at a hole is the one logged, else the line's stations at x.
 */
import type { EntityManager } from 'typeorm';
import { groundAt } from '../../shared/boreholes';
import type { BoreholeBody, BoreholeView } from '../../shared/schemas/boreholes';
import { dataSource } from '../db/dataSource';
import { HttpError } from '../http/errors';
import { audit } from './audit';

interface Row {
  id: string; line_id: string; name: string; kind: BoreholeView['kind']; x: number; ground_z: number | null; water_depth: number | null;
  contacts: BoreholeView['contacts']; note: string; created_by_name: string | null; created_at: Date; updated_at: Date;
}

const SELECT = `SELECT b.*, u.name AS created_by_name FROM boreholes b LEFT JOIN users u ON u.id = b.created_by`;

function viewOf(r: Row, stations: { x: number; z: number }[]): BoreholeView {
  return {
    id: r.id,
    lineId: r.line_id,
    name: r.name,
    kind: r.kind,
    x: r.x,
    groundZ: r.ground_z,
    waterDepth: r.water_depth,
    contacts: r.contacts,
    note: r.note,
    groundZResolved: r.ground_z ?? groundAt(stations, r.x),
    createdBy: r.created_by_name ?? '',
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}

const stationsOf = (lineId: string): Promise<{ x: number; z: number }[]> => dataSource.query('SELECT x, z FROM stations WHERE line_id = $1', [lineId]);

/** A line's holes, ordered along the line. */
export async function listBoreholes(lineId: string): Promise<BoreholeView[]> {
  const [rows, stations] = await Promise.all([dataSource.query(`${SELECT} WHERE b.line_id = $1 ORDER BY b.x, b.name`, [lineId]) as Promise<Row[]>, stationsOf(lineId)]);
  return rows.map((r) => viewOf(r, stations));
}

async function oneBorehole(id: string): Promise<BoreholeView> {
  const [row]: Row[] = await dataSource.query(`${SELECT} WHERE b.id = $1`, [id]);
  return viewOf(row, await stationsOf(row.line_id));
}

const nameTaken = (name: string) => new HttpError(409, 'borehole_name_taken', `A hole named ${name} is already on this line; give this one another name or edit that one.`);
const isUniqueViolation = (err: unknown) => (err as { code?: string }).code === '23505';

async function insert(em: EntityManager, actorId: string, lineId: string, b: BoreholeBody): Promise<string> {
  const [row] = await em.query(
    `INSERT INTO boreholes (line_id, name, kind, x, ground_z, water_depth, contacts, note, created_by) VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9) RETURNING id`,
    [lineId, b.name, b.kind, b.x, b.groundZ, b.waterDepth, JSON.stringify(b.contacts), b.note, actorId],
  );
  return row.id as string;
}

export async function createBorehole(actorId: string, projectId: string, lineId: string, body: BoreholeBody): Promise<BoreholeView> {
  try {
    const id = await dataSource.transaction(async (em) => {
      const id = await insert(em, actorId, lineId, body);
      await audit(em, { actorId, action: 'borehole.create', objectType: 'borehole', objectId: id, projectId, detail: { name: body.name, x: body.x, contacts: body.contacts.length } });
      return id;
    });
    return await oneBorehole(id);
  } catch (err) {
    throw isUniqueViolation(err) ? nameTaken(body.name) : err;
  }
}

/** Every hole of a file, all or none; a name already on the line is a file problem on the hole's first line. */
export async function createBoreholesFromFile(actorId: string, projectId: string, lineId: string, fileName: string, holes: (BoreholeBody & { line: number })[]): Promise<BoreholeView[]> {
  const taken: { name: string }[] = await dataSource.query('SELECT name FROM boreholes WHERE line_id = $1 AND name = ANY($2::text[])', [lineId, holes.map((h) => h.name)]);
  if (taken.length) {
    const clashes = holes.filter((h) => taken.some((t) => t.name === h.name));
    throw new HttpError(422, 'invalid_boreholes', `${fileName} was not stored: line ${clashes[0].line}, hole: ${clashes[0].name} is already on this line.`,
      clashes.map((h) => ({ line: h.line, column: 'hole', message: `${h.name} is already on this line; rename it in the file or edit the one on the line` })));
  }
  await dataSource.transaction(async (em) => {
    for (const { line: _line, ...hole } of holes) await insert(em, actorId, lineId, hole);
    await audit(em, { actorId, action: 'borehole.upload', objectType: 'line', objectId: lineId, projectId, detail: { fileName, holes: holes.map((h) => h.name) } });
  });
  const all = await listBoreholes(lineId);
  return all.filter((b) => holes.some((h) => h.name === b.name));
}

export async function updateBorehole(actorId: string, projectId: string, id: string, body: BoreholeBody): Promise<BoreholeView> {
  try {
    await dataSource.transaction(async (em) => {
      await em.query(
        `UPDATE boreholes SET name = $2, kind = $3, x = $4, ground_z = $5, water_depth = $6, contacts = $7, note = $8, updated_at = now() WHERE id = $1`,
        [id, body.name, body.kind, body.x, body.groundZ, body.waterDepth, JSON.stringify(body.contacts), body.note],
      );
      await audit(em, { actorId, action: 'borehole.update', objectType: 'borehole', objectId: id, projectId, detail: { name: body.name } });
    });
  } catch (err) {
    throw isUniqueViolation(err) ? nameTaken(body.name) : err;
  }
  return oneBorehole(id);
}

export async function deleteBorehole(actorId: string, projectId: string, id: string): Promise<void> {
  await dataSource.transaction(async (em) => {
    const [row] = await em.query('DELETE FROM boreholes WHERE id = $1 RETURNING name', [id]);
    await audit(em, { actorId, action: 'borehole.delete', objectType: 'borehole', objectId: id, projectId, detail: { name: row?.name ?? null } });
  });
}
