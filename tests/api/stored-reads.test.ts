/**
 * Issue 16 item 10: pick-set checks and model grids are computed once and stored, not recomputed
 * on every read. What is served must equal a fresh computation by the shared code (runPickQc,
 * rasteriseModel) on the same input; rows made before the tables existed are filled on first read,
 * once, even when several reads arrive together.
 */
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dataSource } from '../../server/db/dataSource';
import { parsePickText } from '../../shared/picks';
import { rasteriseModel, type ModelFile } from '../../shared/model';
import { runPickQc } from '../../shared/qc';
import { binaryBody, signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, WORLD_MODEL, WORLD_PICKS, type World } from './support/world';

const rows = async (sql: string, params: unknown[]) => Number((await dataSource.query(sql, params))[0].n);

/** The checks as the shared code computes them on the world's picks, with the given picks excluded. */
function freshQc(excluded: number[] = []) {
  const parsed = parsePickText(WORLD_PICKS);
  if (!parsed.ok) throw new Error('world picks do not parse');
  const picks = parsed.picks.map((p, i) => ({ index: i, shotId: p.shotId, sourceX: p.sourceX, receiverX: p.receiverX, time: p.time, sigma: p.sigma, excluded: excluded.includes(i) }));
  return JSON.parse(JSON.stringify(runPickQc(picks, { reciprocalToleranceS: 0.002 })));
}

describe('stored reads', () => {
  let t: TestApp;
  let world: World;
  let geo: Agent;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
  });
  afterAll(async () => t?.close());

  it('an upload stores revision 0 checks, and the read serves exactly what the shared code computes', async () => {
    expect(await rows('SELECT count(*) AS n FROM pick_set_qc WHERE pick_set_id = $1 AND revision = 0', [world.pickSetA])).toBe(1);
    const res = await geo.get(`/api/picksets/${world.pickSetA}`).expect(200);
    const { reciprocalPairs, flags } = res.body.qc;
    expect({ reciprocalPairs, flags }).toEqual(freshQc());
    expect(res.body.qc.reciprocalToleranceMs).toBe(2);
  });

  it('a revision made before its checks were stored gets them on first read, once, even for parallel reads', async () => {
    const rev = await geo.post(`/api/picksets/${world.pickSetA}/revisions`).set('X-CSRF-Token', geo.csrf).send({ exclusions: [{ index: 5, reason: 'test' }] });
    expect(rev.status).toBe(201);
    await dataSource.query('DELETE FROM pick_set_qc WHERE pick_set_id = $1', [world.pickSetA]);
    const reads = await Promise.all([1, 2, 3].map(() => geo.get(`/api/picksets/${world.pickSetA}`)));
    for (const r of reads) {
      expect(r.status).toBe(200);
      expect({ reciprocalPairs: r.body.qc.reciprocalPairs, flags: r.body.qc.flags }).toEqual(freshQc([5]));
    }
    // Pick 5 (shot R, receiver at 0 m) is excluded, so the reciprocal pair F↔R has lost its reverse time.
    expect(reads[0].body.qc.reciprocalPairs).toEqual([]);
    expect(await rows('SELECT count(*) AS n FROM pick_set_qc WHERE pick_set_id = $1', [world.pickSetA])).toBe(1);
    const old = await geo.get(`/api/picksets/${world.pickSetA}?revision=0`).expect(200);
    expect(old.body.qc.reciprocalPairs).toEqual(freshQc().reciprocalPairs);
  });

  it('a saved model version stores its grid; the read sends the same Float32 values as rasterising afresh', async () => {
    expect(await rows('SELECT count(*) AS n FROM model_rasters WHERE model_id = $1', [world.modelA])).toBe(1);
    const raster = rasteriseModel(WORLD_MODEL as ModelFile);
    const expected = Buffer.from(new Float32Array(raster.velocity).buffer);
    const plain = await geo.get(`/api/models/${world.modelA}/grid`).set('Accept-Encoding', 'identity').buffer(true).parse(binaryBody).expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(Buffer.compare(plain.body, expected)).toBe(0);
    // A client that accepts gzip gets the stored bytes as they are.
    const zipped = await geo.get(`/api/models/${world.modelA}/grid`).set('Accept-Encoding', 'gzip').buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(zipped.status).toBe(200);
    if (zipped.headers['content-encoding'] === 'gzip' && zipped.body[0] === 0x1f) expect(Buffer.compare(gunzipSync(zipped.body), expected)).toBe(0);
    else expect(Buffer.compare(zipped.body, expected)).toBe(0); // the test client inflated it already
  });

  it('a model version without a stored grid is rasterised on first read and stored once', async () => {
    await dataSource.query('DELETE FROM model_rasters WHERE model_id = $1', [world.modelA]);
    const reads = await Promise.all([1, 2, 3].map(() => geo.get(`/api/models/${world.modelA}`)));
    for (const r of reads) {
      expect(r.status).toBe(200);
      expect(r.body.summary).toMatchObject({ grid: WORLD_MODEL.grid, nodes: 51 * 21, activeNodes: 51 * 21, vMin: 600, vMax: 600 });
      expect(r.body.model).toEqual(WORLD_MODEL);
    }
    expect(await rows('SELECT count(*) AS n FROM model_rasters WHERE model_id = $1', [world.modelA])).toBe(1);
  });
});
