/**
 * Section exports (issue 19 item 2–3), read back by independent readers:
 * - DXF by Debian's python3-ezdxf (a general-purpose DXF library), entity by entity: layers, polyline
 *   vertices in metres, text, drawing units;
 * - GeoJSON against RFC 7946 (Butler et al. 2016): a FeatureCollection, positions longitude then
 *   latitude in WGS 84 (section 3.1.1, 4), no "crs" member; station positions against PROJ's cs2cs;
 * - depth to rock against the model's own interface, computed here by hand from its polylines.
 */
import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { saveModelVersion } from '../../server/services/models';
import { signedInAgent, startTestApp, type Agent, type TestApp } from './support/app';
import { emailOf, PASSWORD, resetWorld, type World } from './support/world';

// Ground rises from 105 m at x = 0 to 107 m at x = 40; the topsoil's base falls from 102 to 100 m:
// rock lies 3 + x/10 m below ground (3 m at x = 0, 7 m at x = 40).
const MODEL = {
  format: 'timefield-model/1',
  grid: { x0: 0, dx: 1, nx: 41, z0: 110, dz: 0.5, nz: 41 },
  surface: [[0, 105], [40, 107]],
  layers: [
    { name: 'topsoil', base: [[0, 102], [40, 100]], v_top: 500, v_base: 700 },
    { name: 'sandstone', v_top: 3000, v_base: 3000 },
  ],
};
const STATIONS = [0, 10, 20, 30, 40].map((x, i) => ({ station: i + 1, x, z: 105 + x / 20, easting: 500000 + x, northing: 5000000 }));

/** ezdxf's reading of a DXF file: layers, units, and per entity its type, layer, points or text. */
function readDxf(dxf: string): { layers: string[]; units: number; entities: { type: string; layer: string; points?: number[][]; text?: string }[] } {
  const script = `
import sys, json, ezdxf, io
doc = ezdxf.read(io.StringIO(sys.stdin.read()))
out = {'layers': [l.dxf.name for l in doc.layers], 'units': doc.header.get('$INSUNITS', 0), 'entities': []}
for e in doc.modelspace():
    item = {'type': e.dxftype(), 'layer': e.dxf.layer}
    if e.dxftype() == 'LWPOLYLINE': item['points'] = [[p[0], p[1]] for p in e.get_points('xy')]
    if e.dxftype() == 'TEXT': item['text'] = e.dxf.text
    out['entities'].append(item)
print(json.dumps(out))`;
  return JSON.parse(execFileSync('/usr/bin/python3', ['-c', script], { input: dxf, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 }));
}

describe('section exports', () => {
  let t: TestApp;
  let world: World;
  let geo: Agent;
  let modelId: string;
  beforeAll(async () => {
    t = await startTestApp();
    world = await resetWorld();
    geo = await signedInAgent(t.app, emailOf('geophysicist'), PASSWORD);
    modelId = (await saveModelVersion(world.users.geophysicist.id, world.projectA.id, world.lineA.id, MODEL, { name: 'two layers', comment: '', basedOn: null })).id;
    const tech = await signedInAgent(t.app, emailOf('field_tech'), PASSWORD);
    expect((await tech.put(`/api/lines/${world.lineA.id}/stations`).set('X-CSRF-Token', tech.csrf).send(STATIONS)).status).toBe(200);
  });
  afterAll(async () => t?.close());

  it('writes a DXF that an independent reader finds whole: layers, ground and interface in metres, stations, title and cautions', async () => {
    const res = await geo.get(`/api/models/${modelId}/export/section.dxf`).buffer(true).parse((r, cb) => { let s = ''; r.on('data', (c: Buffer) => (s += c)); r.on('end', () => cb(null, s)); });
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?A-1-Model-two-layers-version-1\.dxf"?$/);
    const dxf = readDxf(res.body as string);
    expect(dxf.units).toBe(6); // metres
    for (const layer of ['TF_GROUND', 'TF_INTERFACES', 'TF_STATIONS', 'TF_TITLE', 'TF_BOREHOLES']) expect(dxf.layers).toContain(layer);
    const on = (layer: string, type: string) => dxf.entities.filter((e) => e.layer === layer && e.type === type);
    expect(on('TF_GROUND', 'LWPOLYLINE').map((e) => e.points)).toEqual([[[0, 105], [40, 107]]]);
    expect(on('TF_INTERFACES', 'LWPOLYLINE').map((e) => e.points)).toEqual([[[0, 102], [40, 100]]]);
    expect(on('TF_STATIONS', 'TEXT').map((e) => e.text)).toEqual(['1', '2', '3', '4', '5']);
    const title = on('TF_TITLE', 'TEXT').map((e) => e.text).join(' ');
    expect(title).toMatch(/vertical exaggeration 1:1/);
    expect(title).toMatch(/No ray coverage: this section is a model/);
    expect(title).toMatch(/non-unique.*reviewed by a qualified professional/);
    // Iso-velocity contours, each on its own layer, labelled in m/s.
    expect(dxf.layers.some((l) => /^TF_ISOVELOCITY_\d+$/.test(l))).toBe(true);
  });

  it('tabulates depth to rock at every station as the model draws it (3 + x/10 m), with coordinates', async () => {
    const res = await geo.get(`/api/models/${modelId}/export/depth-to-rock.csv?classes=none`);
    expect(res.status).toBe(200);
    const rows = (res.text as string).split('\n').filter((l) => l && !l.startsWith('#'));
    expect(rows[0]).toBe('station,chainage_m,easting_m,northing_m,ground_elevation_m,rock_depth_m,rock_elevation_m,note');
    const table = rows.slice(1).map((r) => r.split(','));
    expect(table.map((r) => Number(r[5]))).toEqual([3, 4, 5, 6, 7]);
    expect(table.map((r) => Number(r[2]))).toEqual([500000, 500010, 500020, 500030, 500040]);
    expect(res.text).toMatch(/# rock surface: the base of topsoil/);
    // The line's borehole is tied after the table (world: a hole at x 5 m, top of rock logged at 3 m; the model puts it at 3 + 5/10 m).
    expect(res.text).toMatch(/# tie at BH\d+ \(x 5 m\): rock logged at 3 m, interpreted 3\.50 m, difference \+0\.50 m/);
    const classes = await geo.get(`/api/models/${modelId}/export/depth-to-rock.csv`);
    expect(classes.text).toMatch(/Weaver|only indicate how the ground may dig/);
    expect(classes.text).toMatch(/depth_to_1200_m_s_hard_ripping_m/);
    expect((await geo.get(`/api/models/${modelId}/export/depth-to-rock.csv?rock=interface:5`)).status).toBe(400);
    expect((await geo.get(`/api/models/${modelId}/export/depth-to-rock.csv?classes=fast`)).body.message).toMatch(/is not a band/);
  });

  it('writes every ground node to the gridded CSV with its coordinates, and says the section has no coverage', async () => {
    const res = await geo.get(`/api/models/${modelId}/export/section.csv`);
    const lines = (res.text as string).split('\n').filter(Boolean);
    expect(lines.some((l) => /# this section has no ray coverage/.test(l))).toBe(true);
    const rows = lines.filter((l) => !l.startsWith('#')).slice(1).map((l) => l.split(','));
    let ground = 0;
    for (let ix = 0; ix <= 40; ix++) for (let iz = 0; iz <= 40; iz++) if (110 - 0.5 * iz <= 105 + ix / 20 + 1e-9) ground++;
    expect(rows.length).toBe(ground);
    const deep = rows.find((r) => r[0] === '10.000' && r[3] === '92.000')!;
    expect(deep).toEqual(['10.000', '500010.000', '5000000.000', '92.000', '3000', '', '']);
  });

  it('writes GeoJSON as RFC 7946 asks once the project has a CRS, and refuses before', async () => {
    const before = await geo.get(`/api/models/${modelId}/export/depth-to-rock.geojson`);
    expect(before.status).toBe(422);
    expect(before.body.message).toMatch(/set the project’s coordinate system/);
    const lead = await signedInAgent(t.app, emailOf('lead'), PASSWORD);
    await lead.patch(`/api/projects/${world.projectA.id}`).set('X-CSRF-Token', lead.csrf).send({ crsEpsg: 32633 });
    const res = await geo.get(`/api/models/${modelId}/export/depth-to-rock.geojson`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/geo\+json/);
    const fc = JSON.parse(res.text);
    expect(fc.type).toBe('FeatureCollection');
    expect(fc.crs).toBeUndefined();
    const stations = fc.features.filter((f: { properties: { kind: string } }) => f.properties.kind === 'station');
    const reference = execFileSync('cs2cs', ['EPSG:32633', 'EPSG:4326', '-f', '%.9f'], { input: STATIONS.map((s) => `${s.easting} ${s.northing}`).join('\n') + '\n', encoding: 'utf8' })
      .trim().split('\n').map((l) => l.trim().split(/\s+/).slice(0, 2).map(Number)); // latitude, longitude
    stations.forEach((f: { geometry: { coordinates: number[] } }, i: number) => {
      const [lon, lat] = f.geometry.coordinates;
      expect(Math.abs(lon - reference[i][1])).toBeLessThan(2e-7);
      expect(Math.abs(lat - reference[i][0])).toBeLessThan(2e-7);
    });
    const line = fc.features.find((f: { geometry: { type: string } }) => f.geometry.type === 'LineString');
    expect(line.geometry.coordinates).toHaveLength(5);
    const depths = fc.features.filter((f: { properties: { kind: string } }) => f.properties.kind === 'depth to rock').map((f: { properties: { rock_depth_m: number } }) => f.properties.rock_depth_m);
    expect(depths).toEqual([3, 4, 5, 6, 7]);
  });

  it('draws the project plan in its grid (DXF, read back by ezdxf) and in WGS 84 (GeoJSON)', async () => {
    const plan = await geo.get(`/api/projects/${world.projectA.id}/plan`);
    expect(plan.status).toBe(200);
    expect(plan.body.lines.find((l: { name: string }) => l.name === 'A-1').stations).toHaveLength(5);
    const res = await geo.get(`/api/projects/${world.projectA.id}/plan.dxf`).buffer(true).parse((r, cb) => { let s = ''; r.on('data', (c: Buffer) => (s += c)); r.on('end', () => cb(null, s)); });
    const dxf = readDxf(res.body as string);
    for (const layer of ['TF_PLAN_LINES', 'TF_PLAN_STATIONS', 'TF_PLAN_NORTH_ARROW', 'TF_PLAN_SCALE_BAR', 'TF_PLAN_TITLE']) expect(dxf.layers).toContain(layer);
    const lines = dxf.entities.filter((e) => e.layer === 'TF_PLAN_LINES' && e.type === 'LWPOLYLINE').map((e) => e.points);
    expect(lines).toEqual([STATIONS.map((s) => [s.easting, s.northing])]);
    expect(dxf.entities.filter((e) => e.layer === 'TF_PLAN_STATIONS' && e.type === 'POINT')).toHaveLength(5);
    const texts = dxf.entities.filter((e) => e.type === 'TEXT').map((e) => e.text);
    expect(texts).toContain('N');
    expect(texts).toContain('Line A-1');
    expect(texts.some((t) => /Not drawn \(no station coordinates\): /.test(t ?? ''))).toBe(false); // project A has one line, with coordinates
    const geojson = await geo.get(`/api/projects/${world.projectA.id}/plan.geojson`);
    expect(geojson.status).toBe(200);
    const fc = JSON.parse(geojson.text);
    expect(fc.type).toBe('FeatureCollection');
    for (const f of fc.features) {
      const positions = f.geometry.type === 'Point' ? [f.geometry.coordinates] : f.geometry.coordinates;
      for (const [lon, lat] of positions) expect(Math.abs(lon) <= 180 && Math.abs(lat) <= 90 && lon > 14 && lon < 16 && lat > 44 && lat < 46).toBe(true); // near 15°E 45°N
    }
  });

  it('hands a report\'s files to staff, and to a client only once the report is shared', async () => {
    const staff = await geo.get(`/api/reports/${world.reportA}/export/depth-to-rock.csv`);
    expect(staff.status).toBe(200);
    expect(staff.text).toMatch(/# rock surface: the 2500 m\/s iso-velocity/); // the report's iso-velocity
    const client = await signedInAgent(t.app, emailOf('client'), PASSWORD);
    const refused = await client.get(`/api/reports/${world.reportA}/export/depth-to-rock.csv`);
    expect(refused.status).toBe(403);
    expect(refused.body.message).toBe('This report has not been shared with you yet.');
    expect((await geo.get(`/api/reports/${world.reportA}/export/section.csv`)).status).toBe(404);
  });

  it('names the files it knows and refuses others', async () => {
    const res = await geo.get(`/api/models/${modelId}/export/section.svg`);
    expect(res.status).toBe(404);
    expect(res.body.message).toMatch(/use one of section\.dxf, section\.csv/);
  });
});
