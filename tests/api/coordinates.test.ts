/**
 * Real-world coordinates (issue 19 item 1): the project's CRS, stations in easting/northing or GNSS
 * longitude/latitude, chainage computed along a bent line, and bad input refused with its line.
 * Outside reference for the conversion: PROJ's cs2cs (Debian proj-bin).
 */
import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

describe('project coordinates and stations with easting and northing', () => {
  let t: TestApp;
  let world: World;
  let lead: Agent;
  let tech: Agent;
  const stationsUrl = () => `/api/lines/${world.lineA.id}/stations`;
  const upload = (csv: string) => tech.put(stationsUrl()).set('X-CSRF-Token', tech.csrf).attach('file', Buffer.from(csv), 'stations.csv');
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
    tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
  });
  afterAll(async () => t?.close());

  it('sets the project CRS by EPSG code and refuses codes it cannot use, with the reason', async () => {
    const path = `/api/projects/${world.projectA.id}`;
    expect((await lead.get(path)).body.crs).toBeNull();
    const found = await lead.get('/api/crs?q=utm%2033n');
    expect(found.body.map((c: { code: number }) => c.code)).toContain(32633);
    for (const [code, reason] of [
      [99999, 'EPSG:99999 is not a coordinate reference system Timefield knows.'],
      [4326, 'EPSG:4326 (WGS 84) is geographic (degrees): a project needs a projected grid in metres, such as a UTM zone or a national grid.'],
    ] as const) {
      const res = await lead.patch(path).set('X-CSRF-Token', lead.csrf).send({ crsEpsg: code });
      expect(res.status).toBe(422);
      expect(res.body.message).toBe(reason);
    }
    const ok = await lead.patch(path).set('X-CSRF-Token', lead.csrf).send({ crsEpsg: 32633 });
    expect(ok.status).toBe(200);
    expect(ok.body.crs).toMatchObject({ code: 32633, name: 'WGS 84 / UTM zone 33N', lonLat: true });
  });

  it('computes chainage along a line that bends from easting and northing (3-4-5 steps)', async () => {
    const csv = 'station,easting,northing,z\n1,500000,5000000,100\n2,500005,5000000,100.5\n3,500010,5000000,101\n4,500013,5000004,101.2\n5,500016,5000008,101.1\n';
    const res = await upload(csv);
    expect(res.status).toBe(200);
    expect(res.body.stations.map((s: { x: number }) => s.x)).toEqual([0, 5, 10, 15, 20]);
    expect(res.body.stations[3]).toEqual({ station: 4, x: 15, z: 101.2, easting: 500013, northing: 5000004 });
  });

  it('turns GNSS longitude/latitude into the project grid as PROJ does', async () => {
    const points = [[15.001, 45.0], [15.0011, 45.00004], [15.0012, 45.00008]];
    const csv = 'station,lon,lat,z\n' + points.map(([lon, lat], i) => `${i + 1},${lon},${lat},${100 + i}`).join('\n') + '\n';
    const res = await upload(csv);
    expect(res.status).toBe(200);
    const reference = execFileSync('cs2cs', ['EPSG:4326', 'EPSG:32633', '-f', '%.4f'], { input: points.map(([lon, lat]) => `${lat} ${lon}`).join('\n') + '\n', encoding: 'utf8' })
      .trim().split('\n').map((l) => l.trim().split(/\s+/).slice(0, 2).map(Number));
    res.body.stations.forEach((s: { easting: number; northing: number }, i: number) => {
      expect(Math.abs(s.easting - reference[i][0])).toBeLessThan(0.001);
      expect(Math.abs(s.northing - reference[i][1])).toBeLessThan(0.001);
    });
  });

  it('refuses doubling back, jumps, points outside the area of use and half-given coordinates, naming the line, and keeps the table', async () => {
    const before = (await tech.get(`/api/lines/${world.lineA.id}`)).body.stations;
    const back = await upload('station,easting,northing,z\n1,500000,5000000,100\n2,500005,5000000,100\n3,500010,5000000,100\n4,500006,5000003,100\n');
    expect(back.status).toBe(422);
    expect(back.body.issues[0]).toMatchObject({ line: 5, column: 'easting' });
    expect(back.body.issues.map((i: { message: string }) => i.message).join(' ')).toMatch(/turns the line back/);
    const jump = await upload('station,easting,northing,z\n1,500000,5000000,100\n2,500005,5000000,100\n3,500010,5000000,100\n4,500510,5000000,100\n5,500515,5000000,100\n');
    expect(jump.body.issues[0]).toMatchObject({ line: 5, column: 'easting' });
    expect(jump.body.message).toMatch(/line 5, easting: is 500\.0 m from the station before it/);
    const wrongZone = await upload('station,easting,northing,z\n1,900000,5000000,100\n2,900005,5000000,100\n');
    expect(wrongZone.status).toBe(422);
    expect(wrongZone.body.issues[0].message).toMatch(/outside the area of use of EPSG:32633 \(WGS 84 \/ UTM zone 33N\)/);
    const farLonLat = await upload('station,lon,lat,z\n1,25,45,100\n2,25.0001,45,100\n');
    expect(farLonLat.body.issues[0]).toMatchObject({ line: 2, column: 'lon' });
    const half = await upload('station,x,easting,z\n1,0,500000,100\n');
    expect(half.body.message).toMatch(/easting without northing/);
    const json = await tech.put(stationsUrl()).set('X-CSRF-Token', tech.csrf).send([{ station: 1, x: 0, z: 1, easting: 500000 }]);
    expect(json.status).toBe(422);
    expect((await tech.get(`/api/lines/${world.lineA.id}`)).body.stations).toEqual(before);
  });

  it('asks for the project CRS before it takes longitude and latitude', async () => {
    await lead.patch(`/api/projects/${world.projectA.id}`).set('X-CSRF-Token', lead.csrf).send({ crsEpsg: null });
    const res = await upload('station,lon,lat,z\n1,15,45,100\n2,15.0001,45,100\n');
    expect(res.status).toBe(422);
    expect(res.body.issues[0]).toMatchObject({ line: 1, column: 'lon' });
    expect(res.body.issues[0].message).toMatch(/set it on the project page/);
  });
});
