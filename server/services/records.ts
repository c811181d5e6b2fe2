/**
 * Field records on a line (issue 12): stored whole (the original bytes) with the headers read from
 * them by shared/records, so the pages can parse the same bytes again and the server never sends
 * samples as JSON. A file the reader refuses is refused whole (422 with the byte offset); nothing is
 * stored. Receiver positions: a trace's own header, else the line's station whose number is the
 * channel — the rule of `npm run pick --stations`.
 */
import { createHash } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import { readRecord, RecordFormatError, type SeismicRecord } from '../../shared/records';
import type { PicksFromRecordsBody, RecordDetailView, RecordGeometryBody, RecordSummaryView, RecordTraceView } from '../../shared/schemas/records';
import { importPicks, type ImportedPickSet } from './importPicks';
import { dataSource } from '../db/dataSource';
import { HttpError } from '../http/errors';
import { audit } from './audit';

/** Headers kept per record (everything but the samples). */
interface StoredHeader {
  channels: number;
  sampleIntervalMs: number;
  samplesPerTrace: number;
  delayMs: number;
  acquired: string | null;
  keywords: Record<string, string>;
  notes: string[];
  traces: { index: number; channel: number; receiver: { x: number; z: number | null } | null; sampleIntervalMs: number; samples: number; delayMs: number; stack: number | null; markedDead: boolean }[];
}

const ms = (s: number) => +(s * 1000).toFixed(6);

function headerOf(record: SeismicRecord): StoredHeader {
  const first = record.traces[0];
  return {
    channels: record.traces.length,
    sampleIntervalMs: first ? ms(first.sampleInterval) : 0,
    samplesPerTrace: first ? first.samples.length : 0,
    delayMs: first ? ms(first.delay) : 0,
    acquired: record.acquired,
    keywords: record.keywords,
    notes: record.notes,
    traces: record.traces.map((t) => ({
      index: t.index,
      channel: t.channel,
      receiver: t.receiver ? { x: t.receiver.x, z: t.receiver.z } : null,
      sampleIntervalMs: ms(t.sampleInterval),
      samples: t.samples.length,
      delayMs: ms(t.delay),
      stack: t.stack,
      markedDead: t.markedDead,
    })),
  };
}

/** The shot id a record's picks carry: the file name without its extension (as `npm run pick`). */
export const shotIdOf = (fileName: string): string => fileName.replace(/\.[^.]*$/, '') || fileName;

export async function storeRecord(actorId: string, projectId: string, lineId: string, fileName: string, bytes: Buffer): Promise<RecordSummaryView> {
  let record: SeismicRecord;
  try {
    record = readRecord(new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength), fileName);
  } catch (err) {
    if (err instanceof RecordFormatError) throw new HttpError(422, 'invalid_record', `${fileName}: ${err.message}`);
    throw err;
  }
  if (record.traces.length === 0) throw new HttpError(422, 'invalid_record', `${fileName}: the record holds no trace.`);
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  const header = headerOf(record);
  const source = record.traces.find((t) => t.source)?.source ?? null;
  const live = header.traces.filter((t) => !t.markedDead);
  const receiversFrom = live.length > 0 && live.every((t) => t.receiver) ? 'header' : 'stations';
  const id = await dataSource.transaction(async (em) => {
    const [dup] = await em.query('SELECT file_name FROM records WHERE line_id = $1 AND sha256 = $2', [lineId, sha256]);
    if (dup) throw new HttpError(409, 'duplicate_record', `This file is already on the line, as ${dup.file_name}.`);
    const [row] = await em.query(
      `INSERT INTO records (line_id, file_name, bytes, size_bytes, sha256, format, revision, header, shot_id, source_x, source_z, source_from, receivers_from, uploaded_by)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13, $14) RETURNING id`,
      [lineId, fileName, bytes, bytes.length, sha256, record.format, record.revision, JSON.stringify(header), shotIdOf(fileName),
        source?.x ?? null, source?.z ?? null, source ? 'header' : 'none', receiversFrom, actorId],
    );
    await audit(em, { actorId, action: 'record.upload', objectType: 'record', objectId: row.id, projectId, detail: { fileName, format: record.format, traces: record.traces.length } });
    return row.id as string;
  });
  return (await listRecords(lineId, id))[0]!;
}

interface Row {
  id: string; line_id: string; file_name: string; size_bytes: number; sha256: string; format: 'seg2' | 'segy'; revision: string;
  header: StoredHeader; shot_id: string; source_x: number | null; source_z: number | null; source_from: RecordSummaryView['sourceFrom'];
  receivers_from: RecordSummaryView['receiversFrom']; uploaded_by_name: string | null; uploaded_at: Date; pick_set_ids: string[] | null;
}

function summaryOf(r: Row): RecordSummaryView {
  const h = r.header;
  return {
    id: r.id,
    lineId: r.line_id,
    fileName: r.file_name,
    format: r.format,
    revision: r.revision,
    bytes: r.size_bytes,
    sha256: r.sha256,
    channels: h.channels,
    sampleIntervalMs: h.sampleIntervalMs,
    samplesPerTrace: h.samplesPerTrace,
    recordLengthMs: +((h.samplesPerTrace - 1) * h.sampleIntervalMs).toFixed(6),
    delayMs: h.delayMs,
    acquired: h.acquired,
    shotId: r.shot_id,
    source: r.source_x === null ? null : { x: r.source_x, z: r.source_z },
    sourceFrom: r.source_from,
    receiversFrom: r.receivers_from,
    uploadedBy: r.uploaded_by_name ?? 'a former member',
    uploadedAt: r.uploaded_at.toISOString(),
    pickSetIds: r.pick_set_ids ?? [],
  };
}

/** The line's records, newest first (or the one named). */
export async function listRecords(lineId: string, onlyId?: string): Promise<RecordSummaryView[]> {
  const rows: Row[] = await dataSource.query(
    `SELECT r.id, r.line_id, r.file_name, r.size_bytes, r.sha256, r.format, r.revision, r.header, r.shot_id, r.source_x, r.source_z,
            r.source_from, r.receivers_from, u.name AS uploaded_by_name, r.uploaded_at,
            (SELECT array_agg(p.pick_set_id) FROM pick_set_records p WHERE p.record_id = r.id) AS pick_set_ids
       FROM records r LEFT JOIN users u ON u.id = r.uploaded_by
      WHERE r.line_id = $1 AND ($2::uuid IS NULL OR r.id = $2)
      ORDER BY r.uploaded_at DESC, r.file_name`,
    [lineId, onlyId ?? null],
  );
  return rows.map(summaryOf);
}

export async function recordDetail(recordId: string): Promise<RecordDetailView> {
  const [{ line_id: lineId }] = await dataSource.query('SELECT line_id FROM records WHERE id = $1', [recordId]);
  const [summary] = await listRecords(lineId, recordId);
  const [{ header }] = await dataSource.query('SELECT header FROM records WHERE id = $1', [recordId]);
  const stations: { station: number; x: number; z: number }[] = await dataSource.query('SELECT station, x, z FROM stations WHERE line_id = $1', [lineId]);
  const byNumber = new Map(stations.map((s) => [s.station, s]));
  const useStations = summary!.receiversFrom === 'stations';
  const traces: RecordTraceView[] = (header as StoredHeader).traces.map((t) => {
    const station = byNumber.get(t.channel);
    const receiver = useStations ? (station ? { x: station.x, z: station.z } : null) : t.receiver ?? (station ? { x: station.x, z: station.z } : null);
    return { ...t, receiver };
  });
  return { ...summary!, traces, keywords: (header as StoredHeader).keywords, notes: (header as StoredHeader).notes };
}

export async function recordFile(recordId: string): Promise<{ fileName: string; bytes: Buffer }> {
  const [row] = await dataSource.query('SELECT file_name, bytes FROM records WHERE id = $1', [recordId]);
  return { fileName: row.file_name, bytes: row.bytes };
}

/** Sets what the file lacks or has wrong: the shot id, the source position, where receivers come from. */
export async function updateRecordGeometry(actorId: string, projectId: string, recordId: string, body: RecordGeometryBody): Promise<RecordDetailView> {
  await dataSource.transaction(async (em) => {
    const sets: string[] = [];
    const values: unknown[] = [recordId];
    const set = (sql: string, v: unknown) => (values.push(v), sets.push(`${sql} = $${values.length}`));
    if (body.shotId !== undefined) set('shot_id', body.shotId);
    if (body.source !== undefined) {
      set('source_x', body.source?.x ?? null);
      set('source_z', body.source?.z ?? null);
      set('source_from', body.source ? 'set' : 'none');
    }
    if (body.receiversFrom !== undefined) set('receivers_from', body.receiversFrom);
    await em.query(`UPDATE records SET ${sets.join(', ')} WHERE id = $1`, values);
    await audit(em, { actorId, action: 'record.update', objectType: 'record', objectId: recordId, projectId, detail: body });
  });
  return recordDetail(recordId);
}

/** Deletes a record no pick set was saved from (409 otherwise: the pick set keeps its link). */
export async function deleteRecord(actorId: string, projectId: string, recordId: string): Promise<void> {
  await dataSource.transaction(async (em) => {
    const [row] = await em.query('SELECT file_name FROM records WHERE id = $1 FOR UPDATE', [recordId]);
    const linked = await em.query('SELECT pick_set_id FROM pick_set_records WHERE record_id = $1', [recordId]);
    if (linked.length) throw new HttpError(409, 'record_in_use', `${row.file_name} was picked for ${linked.length === 1 ? 'a pick set' : `${linked.length} pick sets`}; it is kept with them.`);
    await em.query('DELETE FROM records WHERE id = $1', [recordId]);
    await audit(em, { actorId, action: 'record.delete', objectType: 'record', objectId: recordId, projectId, detail: { fileName: row.file_name } });
  });
}

const csvField = (text: string): string => (/[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text);

/**
 * Picks made on a line's records, stored as a new pick set exactly like an uploaded pick file
 * (FORMATS.md §2 text as its original; the same checks, QC and revision 0), linked to the records.
 * With `replaces`, the new set is the next version of that pick set of the line: the old one is
 * retired in the same transaction (hidden from new work, kept for the runs that used it).
 */
export async function picksFromRecords(actorId: string, projectId: string, lineId: string, body: PicksFromRecordsBody): Promise<ImportedPickSet> {
  const rows: { id: string }[] = await dataSource.query('SELECT id FROM records WHERE line_id = $1 AND id = ANY($2::uuid[])', [lineId, body.recordIds]);
  const onLine = new Set(rows.map((r) => r.id));
  const missing = body.recordIds.findIndex((id) => !onLine.has(id));
  if (missing >= 0) {
    throw new HttpError(422, 'validation_failed', `recordIds[${missing}]: no record of this line has that id`, [{ path: `recordIds[${missing}]`, message: 'no record of this line has that id' }]);
  }
  const text = ['shot_id,source_x,source_z,receiver_x,receiver_z,time_ms,sigma_ms',
    ...body.picks.map((p) => [csvField(p.shot_id), p.source_x, p.source_z ?? '', p.receiver_x, p.receiver_z ?? '', p.time_ms, p.sigma_ms ?? ''].join(','))].join('\n') + '\n';
  const fileName = `${body.name.replace(/[^\w.\- ]+/g, '_')}.picks.csv`;
  return importPicks(actorId, projectId, lineId, fileName, Buffer.from(text), async (em, pickSetId) => {
    await em.query('INSERT INTO pick_set_records (pick_set_id, record_id) SELECT $1, unnest($2::uuid[]) ON CONFLICT DO NOTHING', [pickSetId, body.recordIds]);
    if (body.replaces) await retireReplaced(em, actorId, projectId, lineId, body.replaces, pickSetId, fileName);
  });
}

async function retireReplaced(em: EntityManager, actorId: string, projectId: string, lineId: string, oldId: string, newId: string, newName: string): Promise<void> {
  const [old] = await em.query('SELECT retired_at FROM pick_sets WHERE id = $1 AND line_id = $2 FOR UPDATE', [oldId, lineId]);
  const refuse = (message: string) => new HttpError(422, 'validation_failed', `replaces: ${message}`, [{ path: 'replaces', message }]);
  if (!old) throw refuse('no pick set of this line has that id');
  if (old.retired_at) throw refuse('that pick set is already retired; save as a new pick set instead');
  const reason = `replaced by ${newName}, picked on the records`;
  await em.query('UPDATE pick_sets SET retired_at = now(), retired_by = $2, retire_reason = $3 WHERE id = $1', [oldId, actorId, reason]);
  await audit(em, { actorId, action: 'pickset.retire', objectType: 'pick_set', objectId: oldId, projectId, detail: { reason, replacedBy: newId } });
}
