import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { binaryBody, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

const fixture = (name: string) => readFileSync(`fixtures/picks/${name}`);
const count = async (table: string) => Number((await dataSource.query(`SELECT count(*) AS n FROM ${table}`))[0].n);

describe('stations, pick uploads and quality checks', () => {
  let t: TestApp;
  let world: World;
  let tech: Agent;
  let geo: Agent;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
    geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
  });
  afterAll(async () => t?.close());

  describe('station table', () => {
    const url = () => `/api/lines/${world.lineA.id}/stations`;
    const table = [
      { station: 1, x: 0, z: 101.2 },
      { station: 2, x: 2.5, z: 101.4 },
      { station: 3, x: 5, z: 101.9 },
    ];

    it('saves a JSON table and returns it exactly', async () => {
      const res = await tech.put(url()).set('X-CSRF-Token', tech.csrf).send(table);
      expect(res.status).toBe(200);
      expect(res.body.stations).toEqual(table);
      expect((await tech.get(`/api/lines/${world.lineA.id}`)).body.stations).toEqual(table);
    });

    it('refuses a table with x going back and a repeated station, naming the rows, and keeps the old table', async () => {
      const bad = [...table, { station: 3, x: 4, z: 102 }];
      const res = await tech.put(url()).set('X-CSRF-Token', tech.csrf).send(bad);
      expect(res.status).toBe(422);
      expect(res.body.error).toBe('invalid_stations');
      expect(res.body.issues).toEqual([
        { row: 4, column: 'station', message: 'station 3 already appears in row 3' },
        { row: 4, column: 'x', message: 'x must increase down the table (4 m after 5 m)' },
      ]);
      const typed = await tech.put(url()).set('X-CSRF-Token', tech.csrf).send([{ station: 1, x: 'ten', z: 1 }]);
      expect(typed.status).toBe(422);
      expect(typed.body.issues[0]).toMatchObject({ row: 1, column: 'x' });
      expect((await tech.get(`/api/lines/${world.lineA.id}`)).body.stations).toEqual(table);
    });

    it('reads a CSV upload with free column order and reports file lines', async () => {
      const good = '# levelled 2026-11-30\nz,station,x\n100.5,10,0\n100.7,11,2.5\n';
      const ok = await tech.put(url()).set('X-CSRF-Token', tech.csrf).attach('file', Buffer.from(good), 'stations.csv');
      expect(ok.status).toBe(200);
      expect(ok.body.stations).toEqual([{ station: 10, x: 0, z: 100.5 }, { station: 11, x: 2.5, z: 100.7 }]);
      const bad = 'station,x,z\n1,0,100\n2,abc,100\n';
      const res = await tech.put(url()).set('X-CSRF-Token', tech.csrf).attach('file', Buffer.from(bad), 'stations.csv');
      expect(res.status).toBe(422);
      expect(res.body.issues).toEqual([{ row: 2, line: 3, column: 'x', message: '"abc" is not a number' }]);
    });
  });

  describe('pick uploads', () => {
    const url = () => `/api/lines/${world.lineA.id}/picksets`;

    it('stores a good file whole: the original bytes, the picks and revision 0', async () => {
      const bytes = fixture('line-a.picks.csv');
      const res = await tech.post(url()).set('X-CSRF-Token', tech.csrf).attach('file', bytes, 'line-a.picks.csv');
      expect(res.status).toBe(201);
      const lines = bytes.toString('utf8').split('\n').filter((l) => l.trim() && !l.startsWith('#'));
      const shotIds = new Set(lines.slice(1).map((l) => l.split(',')[0]));
      expect(res.body).toEqual({ id: expect.any(String), shots: shotIds.size, picks: lines.length - 1 });
      const file = await tech.get(`/api/picksets/${res.body.id}/file`).buffer(true).parse(binaryBody);
      expect(Buffer.compare(file.body, bytes)).toBe(0);
      const line = (await tech.get(`/api/lines/${world.lineA.id}`)).body;
      expect(line.pickSets[0]).toMatchObject({ id: res.body.id, fileName: 'line-a.picks.csv', shots: shotIds.size, revision: 0, excluded: 0 });
    });

    const badFiles: [string, number, { line?: number; column?: string; message: RegExp }][] = [
      ['bad-header.picks.csv', 422, { message: /shot_id/ }],
      ['non-numeric.picks.csv', 422, { line: 5, column: 'time_ms', message: /"abc" is not a number/ }],
      ['negative-time.picks.csv', 422, { line: 4, column: 'time_ms', message: /./ }],
      ['shot-two-positions.picks.csv', 422, { column: 'source_x', message: /A02/ }],
      ['empty.picks.csv', 422, { message: /empty/i }],
      ['header-only.picks.csv', 422, { message: /no picks|header/i }],
      ['binary.picks.csv', 422, { message: /is a ZIP archive .*not a pick file \(CSV text\)/ }],
      ['duplicate-pick.picks.csv', 422, { line: 5, message: /./ }],
    ];
    for (const [name, status, expected] of badFiles) {
      it(`refuses ${name} with ${status} and writes nothing`, async () => {
        const before = [await count('pick_sets'), await count('picks'), await count('pick_set_revisions')];
        const res = await tech.post(url()).set('X-CSRF-Token', tech.csrf).attach('file', fixture(name), name);
        expect(res.status).toBe(status);
        expect(res.body.error).toBe('invalid_file');
        const issue = res.body.issues[0];
        if (expected.line) expect(issue.line).toBe(expected.line);
        if (expected.column) expect(issue.column).toBe(expected.column);
        expect(issue.message).toMatch(expected.message);
        expect(res.body.message).toMatch(/not stored/);
        expect([await count('pick_sets'), await count('picks'), await count('pick_set_revisions')]).toEqual(before);
      });
    }

    it('refuses a 30 MB file with 413 and writes nothing', async () => {
      const before = await count('pick_sets');
      const big = Buffer.alloc(30 * 1024 * 1024, 'A01,0,,5,,6.7,0.5\n');
      const res = await tech.post(url()).set('X-CSRF-Token', tech.csrf).attach('file', big, 'big.picks.csv');
      expect(res.status).toBe(413);
      expect(res.body.message).toMatch(/20 MB/);
      expect(await count('pick_sets')).toBe(before);
    });

    it('asks for a file when none is sent', async () => {
      const res = await tech.post(url()).set('X-CSRF-Token', tech.csrf).field('note', 'x');
      expect(res.status).toBe(400);
      expect(res.body.error).toBe('file_missing');
    });
  });

  describe('pick set, quality checks and exclusions', () => {
    it('returns picks in ms with the reciprocal pair of the two end shots', async () => {
      const res = await tech.get(`/api/picksets/${world.pickSetA}`);
      expect(res.status).toBe(200);
      expect(res.body.picks).toHaveLength(10);
      expect(res.body.picks[1]).toMatchObject({ shotId: 'F', receiverX: 6, timeMs: 10, sigmaMs: 0.5, excluded: false });
      expect(res.body.shots).toEqual([
        { shotId: 'F', sourceX: 0, sourceZ: null, picks: 5 },
        { shotId: 'R', sourceX: 24, sourceZ: null, picks: 5 },
      ]);
      // t(F→24 m) = t(R→0 m) = 24 m / 600 m/s = 40 ms: reciprocal times agree.
      expect(res.body.qc.reciprocalPairs).toHaveLength(1);
      expect(res.body.qc.reciprocalPairs[0]).toMatchObject({ shotA: 'F', shotB: 'R', flagged: false });
      expect(res.body.qc.reciprocalPairs[0].difference).toBeCloseTo(0, 9);
    });

    it('lets a geophysicist exclude picks as a new revision, keeping the earlier one', async () => {
      const url = `/api/picksets/${world.pickSetA}/revisions`;
      const body = { exclusions: [{ index: 3, reason: 'noisy trace, cable knocked' }], comment: 'first pass' };
      expect((await tech.post(url).set('X-CSRF-Token', tech.csrf).send(body)).status).toBe(403);
      const res = await geo.post(url).set('X-CSRF-Token', geo.csrf).send(body);
      expect(res.status).toBe(201);
      expect(res.body).toEqual({ number: 1 });
      const latest = (await geo.get(`/api/picksets/${world.pickSetA}`)).body;
      expect(latest.revision.number).toBe(1);
      expect(latest.picks[3]).toMatchObject({ excluded: true, exclusionReason: 'noisy trace, cable knocked' });
      expect(latest.revisions.map((r: { number: number; excluded: number }) => [r.number, r.excluded])).toEqual([[0, 0], [1, 1]]);
      const original = (await geo.get(`/api/picksets/${world.pickSetA}?revision=0`)).body;
      expect(original.picks.filter((p: { excluded: boolean }) => p.excluded)).toEqual([]);
      expect((await geo.get(`/api/picksets/${world.pickSetA}?revision=7`)).status).toBe(404);
    });

    it('refuses exclusions without a reason, repeated, or beyond the last pick', async () => {
      const url = `/api/picksets/${world.pickSetA}/revisions`;
      const noReason = await geo.post(url).set('X-CSRF-Token', geo.csrf).send({ exclusions: [{ index: 1, reason: ' ' }] });
      expect(noReason.status).toBe(400);
      expect(noReason.body.issues[0].path).toBe('exclusions[0].reason');
      const twice = await geo.post(url).set('X-CSRF-Token', geo.csrf).send({ exclusions: [{ index: 1, reason: 'a' }, { index: 1, reason: 'b' }] });
      expect(twice.body.issues[0]).toEqual({ path: 'exclusions[1].index', message: 'pick 1 is listed twice' });
      const beyond = await geo.post(url).set('X-CSRF-Token', geo.csrf).send({ exclusions: [{ index: 10, reason: 'a' }] });
      expect(beyond.status).toBe(422);
      expect(beyond.body.issues[0].path).toBe('exclusions[0].index');
    });
  });
});
