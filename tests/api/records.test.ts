/**
 * Field records on a line (issue 12 item 7): a record is stored whole, its headers read by
 * shared/records (whose layout is checked against Pullan 1990 and python3-segyio elsewhere); the
 * original bytes come back unchanged; a malformed or truncated file is refused whole with the byte
 * offset and nothing is stored; the same file twice is a conflict; receivers without positions in
 * their headers are placed on the line's stations by channel number (as `npm run pick --stations`).
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { writeSeg2 } from '../../shared/records';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

const count = async () => Number((await dataSource.query('SELECT count(*) AS n FROM records'))[0].n);

function record(withPositions: boolean, shift = 0): Buffer {
  return Buffer.from(writeSeg2([1, 2, 3].map((channel) => ({
    samples: Float32Array.from({ length: 400 }, (_, i) => Math.sin(i / 7 + shift) * (i > 40 ? 1 : 0)),
    channel,
    sampleInterval: 0.0005,
    delay: -0.01,
    receiver: withPositions ? { x: 2.5 * channel, y: null, z: null } : null,
    source: withPositions ? { x: 0, y: null, z: null } : null,
  })), { keywords: [['ACQUISITION_DATE', '04/DEC/2026'], ['ACQUISITION_TIME', '10:15:00']] }));
}

describe('records on a line', () => {
  let t: TestApp;
  let world: World;
  let tech: Agent;
  let lead: Agent;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
    lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
  });
  afterAll(async () => t?.close());

  const upload = (bytes: Buffer, name: string) => tech.post(`/api/lines/${world.lineA.id}/records`).set('X-CSRF-Token', tech.csrf).attach('file', bytes, name);

  it('stores a SEG-2 record with its headers, and gives back the very bytes', async () => {
    const bytes = record(true);
    const res = await upload(bytes, 'S101.sg2');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      fileName: 'S101.sg2', format: 'seg2', channels: 3, sampleIntervalMs: 0.5, samplesPerTrace: 400, recordLengthMs: 199.5, delayMs: -10,
      shotId: 'S101', source: { x: 0, z: null }, sourceFrom: 'header', receiversFrom: 'header', acquired: '2026-12-04T10:15:00', pickSetIds: [],
    });
    const list = await lead.get(`/api/lines/${world.lineA.id}/records`).expect(200);
    expect(list.body.map((r: { fileName: string }) => r.fileName)).toContain('S101.sg2');
    const detail = await lead.get(`/api/records/${res.body.id}`).expect(200);
    expect(detail.body.traces.map((tr: { channel: number; receiver: unknown }) => [tr.channel, tr.receiver])).toEqual([[1, { x: 2.5, z: null }], [2, { x: 5, z: null }], [3, { x: 7.5, z: null }]]);
    const file = await lead.get(`/api/records/${res.body.id}/file`).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(file.status).toBe(200);
    expect(Buffer.compare(file.body as Buffer, bytes)).toBe(0);
  });

  it('refuses the same file twice (409) and a truncated or foreign file whole (422, byte offset), storing nothing', async () => {
    const before = await count();
    const again = await upload(record(true), 'S101-copy.sg2');
    expect(again.status).toBe(409);
    expect(again.body.message).toMatch(/already on the line, as S101\.sg2/);
    const cut = await upload(record(true, 1).subarray(0, 300), 'S102.sg2');
    expect(cut.status).toBe(422);
    expect(cut.body.error).toBe('invalid_record');
    expect(cut.body.message).toMatch(/^S102\.sg2: byte \d+/);
    const png = await upload(Buffer.from('\x89PNG\r\n\x1a\nnot a record at all'), 'photo.sg2');
    expect(png.status).toBe(422);
    expect(png.body.message).toMatch(/byte \d+/);
    expect(await count()).toBe(before);
  });

  it('places receivers without header positions on the line\'s stations by channel number', async () => {
    await tech.put(`/api/lines/${world.lineA.id}/stations`).set('X-CSRF-Token', tech.csrf).send([1, 2, 3].map((s) => ({ station: s, x: 10 * s, z: 100 + s }))).expect(200);
    const res = await upload(record(false, 2), 'S103.sg2');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ receiversFrom: 'stations', source: null, sourceFrom: 'none' });
    const detail = await tech.get(`/api/records/${res.body.id}`).expect(200);
    expect(detail.body.traces.map((tr: { receiver: unknown }) => tr.receiver)).toEqual([{ x: 10, z: 101 }, { x: 20, z: 102 }, { x: 30, z: 103 }]);
  });

  it('takes a real instrument\'s SEG-2 file (fixtures/records/seg2-real)', async () => {
    const res = await upload(readFileSync('fixtures/records/seg2-real/three-component-int32.sg2'), 'three-component-int32.sg2');
    expect(res.status).toBe(201);
    expect(res.body.format).toBe('seg2');
    expect(res.body.channels).toBeGreaterThan(0);
  });

  it('saves picks made on records as a pick set linked to them; a linked record cannot be deleted; bad rows refused with their path', async () => {
    const [rec] = (await tech.get(`/api/lines/${world.lineA.id}/records`)).body.filter((r: { fileName: string }) => r.fileName === 'S101.sg2');
    const picks = [1, 2, 3].map((c) => ({ shot_id: 'S101', source_x: 0, source_z: null, receiver_x: 2.5 * c, receiver_z: null, time_ms: 4 + c, sigma_ms: 0.25 }));
    const bad = await tech.post(`/api/lines/${world.lineA.id}/picksets/from-records`).set('X-CSRF-Token', tech.csrf)
      .send({ name: 'hand picks', recordIds: [rec.id], picks: [...picks.slice(0, 2), { ...picks[2], time_ms: -1 }] });
    expect(bad.status).toBe(400);
    expect(bad.body.issues[0].path).toBe('picks[2].time_ms');
    const saved = await tech.post(`/api/lines/${world.lineA.id}/picksets/from-records`).set('X-CSRF-Token', tech.csrf).send({ name: 'hand picks', recordIds: [rec.id], picks });
    expect(saved.status).toBe(201);
    expect(saved.body).toMatchObject({ shots: 1, picks: 3 });
    const set = await tech.get(`/api/picksets/${saved.body.id}`).expect(200);
    expect(set.body.fileName).toBe('hand picks.picks.csv');
    expect(set.body.picks.map((p: { timeMs: number }) => p.timeMs)).toEqual([5, 6, 7]);
    expect((await tech.get(`/api/records/${rec.id}`)).body.pickSetIds).toEqual([saved.body.id]);
    const del = await tech.delete(`/api/records/${rec.id}`).set('X-CSRF-Token', tech.csrf);
    expect(del.status).toBe(409);
    expect(del.body.error).toBe('record_in_use');
  });

  it('saves picks as the next version of a pick set: the old one retired in the same step, kept readable; a wrong id changes nothing', async () => {
    const [rec] = (await tech.get(`/api/lines/${world.lineA.id}/records`)).body.filter((r: { fileName: string }) => r.fileName === 'S101.sg2');
    const picks = [1, 2, 3].map((c) => ({ shot_id: 'S101', source_x: 0, source_z: null, receiver_x: 2.5 * c, receiver_z: null, time_ms: 4.2 + c, sigma_ms: 0.25 }));
    const first = (await tech.post(`/api/lines/${world.lineA.id}/picksets/from-records`).set('X-CSRF-Token', tech.csrf).send({ name: 'repicked v1', recordIds: [rec.id], picks })).body;
    const sets = async () => (await tech.get(`/api/lines/${world.lineA.id}`)).body.pickSets as { id: string; retired: { reason: string } | null }[];
    const before = (await sets()).length;

    // An id that is not a pick set of this line: refused with its path, and no new set is stored.
    const wrong = await tech.post(`/api/lines/${world.lineA.id}/picksets/from-records`).set('X-CSRF-Token', tech.csrf).send({ name: 'repicked v2', recordIds: [rec.id], picks, replaces: rec.id });
    expect(wrong.status).toBe(422);
    expect(wrong.body.issues[0].path).toBe('replaces');
    expect((await sets()).length).toBe(before);

    const second = await tech.post(`/api/lines/${world.lineA.id}/picksets/from-records`).set('X-CSRF-Token', tech.csrf).send({ name: 'repicked v2', recordIds: [rec.id], picks, replaces: first.id });
    expect(second.status).toBe(201);
    const after = await sets();
    expect(after.find((p) => p.id === first.id)?.retired?.reason).toBe('replaced by repicked v2.picks.csv, picked on the records');
    expect(after.find((p) => p.id === second.body.id)?.retired).toBeNull();
    expect((await tech.get(`/api/picksets/${first.id}`)).status).toBe(200); // kept for what used it
    // Replacing it again is refused: it is already retired.
    const again = await tech.post(`/api/lines/${world.lineA.id}/picksets/from-records`).set('X-CSRF-Token', tech.csrf).send({ name: 'repicked v3', recordIds: [rec.id], picks, replaces: first.id });
    expect(again.status).toBe(422);
    expect(again.body.message).toMatch(/already retired/);
  });

  it('sets a missing shot position and deletes an unlinked record', async () => {
    const [rec] = (await tech.get(`/api/lines/${world.lineA.id}/records`)).body.filter((r: { fileName: string }) => r.fileName === 'S103.sg2');
    expect((await tech.patch(`/api/records/${rec.id}`).set('X-CSRF-Token', tech.csrf).send({})).status).toBe(400);
    const set = await tech.patch(`/api/records/${rec.id}`).set('X-CSRF-Token', tech.csrf).send({ shotId: 'S103', source: { x: 15, z: null } });
    expect(set.status).toBe(200);
    expect(set.body).toMatchObject({ shotId: 'S103', source: { x: 15, z: null }, sourceFrom: 'set' });
    expect((await tech.delete(`/api/records/${rec.id}`).set('X-CSRF-Token', tech.csrf)).status).toBe(204);
    expect((await tech.get(`/api/records/${rec.id}`)).status).toBe(404);
  });
});
