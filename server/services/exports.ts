/**
 * Assembles a section for the exports (issue 19) from what made it — a model version, a forward
 * run, an inversion — with the line's stations (and their coordinates), shots and boreholes, and
 * writes it in the format asked for. The writers themselves are pure (shared/exports/).
 */
import { dataSource } from '../db/dataSource';
import { HttpError } from '../http/errors';
import { sectionOfInversion, sectionOfModel, type ExportSection } from '../../shared/exports/section';
import { sectionDxf } from '../../shared/exports/section-dxf';
import { depthToRockCsv, sectionCsv } from '../../shared/exports/csv';
import { depthToRockGeoJson } from '../../shared/exports/geojson';
import { defaultRockSurface, depthToRock, rockDepthAt, rockTies, surfaceName, type RockSurface } from '../../shared/exports/depth-to-rock';
import { EXCAVATABILITY_CAUTION } from '../../shared/exports/excavatability';
import { INTERPRETATION_CAUTION } from '../../shared/exports/csv';
import { parseClasses, WEAVER_1975, type ExcavatabilityClass } from '../../shared/exports/excavatability';
import type { ModelFile } from '../../shared/model';
import { listBoreholes } from './boreholes';
import { loadInversionSection } from './inversionReads';
import { loadModelVersion } from './models';
import { listStations } from './stations';
import { projectCrs } from './stationCoordinates';
import { toLonLat } from '../geo/crs';

export const EXPORT_FILES = ['section.dxf', 'section.csv', 'depth-to-rock.csv', 'depth-to-rock.geojson', 'depth-to-rock.json'] as const;
export type ExportFile = (typeof EXPORT_FILES)[number];

interface LineContext {
  lineId: string;
  projectId: string;
  project: string;
  line: string;
  velocityColours: { min: number; max: number };
}

async function lineContext(lineId: string): Promise<LineContext> {
  const [r] = await dataSource.query(
    `SELECT l.id, l.name AS line, p.id AS project_id, p.name AS project, p.velocity_colour_min, p.velocity_colour_max
       FROM survey_lines l JOIN projects p ON p.id = l.project_id WHERE l.id = $1`,
    [lineId],
  );
  if (!r) throw new HttpError(404, 'not_found', 'Not found.');
  return { lineId, projectId: r.project_id, project: r.project, line: r.line, velocityColours: { min: Number(r.velocity_colour_min), max: Number(r.velocity_colour_max) } };
}

async function common(ctx: LineContext, what: string) {
  const [stations, holes, crs] = await Promise.all([listStations(ctx.lineId), listBoreholes(ctx.lineId), projectCrs(ctx.projectId)]);
  return {
    crs,
    rest: {
      title: { project: ctx.project, line: ctx.line, what, date: new Date().toISOString().slice(0, 10), crs: crs ? `EPSG:${crs.code} ${crs.name}` : null },
      stations,
      holes: holes.map((h) => ({ name: h.name, kind: h.kind, x: h.x, groundZ: h.groundZResolved, contacts: h.contacts })),
    },
  };
}

export interface LoadedSection {
  section: ExportSection;
  ctx: LineContext;
  crsCode: number | null;
  lonLat: boolean;
}

export async function modelSection(modelId: string): Promise<LoadedSection> {
  const m = await loadModelVersion(modelId);
  const ctx = await lineContext(m.lineId);
  const { crs, rest } = await common(ctx, `Model "${m.name}" version ${m.version}`);
  return { section: sectionOfModel(m.model as ModelFile, { ...rest, shots: [] }), ctx, crsCode: crs?.code ?? null, lonLat: Boolean(crs && !crs.noDatumShift) };
}

export async function runSection(runId: string): Promise<LoadedSection> {
  const [run] = await dataSource.query(`SELECT id, line_id, model_id, status, created_at FROM runs WHERE id = $1`, [runId]);
  if (!run) throw new HttpError(404, 'not_found', 'Not found.');
  if (run.status !== 'done') throw new HttpError(409, 'not_finished', 'Only a finished run can be exported.');
  const m = await loadModelVersion(run.model_id);
  const ctx = await lineContext(run.line_id);
  const { crs, rest } = await common(ctx, `Forward run of ${run.created_at.toISOString().slice(0, 10)} on model "${m.name}" version ${m.version}`);
  const shots: { shot_id: string; source_x: number; source_z: number }[] = await dataSource.query(`SELECT shot_id, source_x, source_z FROM run_fields WHERE run_id = $1 ORDER BY source_x`, [runId]);
  return {
    section: sectionOfModel(m.model as ModelFile, { ...rest, shots: shots.map((s) => ({ id: s.shot_id, x: s.source_x, z: s.source_z })) }),
    ctx,
    crsCode: crs?.code ?? null,
    lonLat: Boolean(crs && !crs.noDatumShift),
  };
}

export async function inversionSection(inversionId: string, threshold: number): Promise<LoadedSection> {
  const [inv] = await dataSource.query(`SELECT id, line_id, status, created_at FROM inversions WHERE id = $1`, [inversionId]);
  if (!inv) throw new HttpError(404, 'not_found', 'Not found.');
  if (inv.status !== 'done') throw new HttpError(409, 'not_finished', 'Only a finished inversion can be exported.');
  const s = await loadInversionSection(inversionId);
  const ctx = await lineContext(inv.line_id);
  const { crs, rest } = await common(ctx, `Inversion of ${inv.created_at.toISOString().slice(0, 10)}`);
  return {
    section: sectionOfInversion(s, threshold, { ...rest, shots: s.shots.map((p) => ({ id: p.shotId, x: p.x, z: p.z })) }),
    ctx,
    crsCode: crs?.code ?? null,
    lonLat: Boolean(crs && !crs.noDatumShift),
  };
}

/** A download name from free text: letters, digits, dot, dash and underscore; the rest one dash. */
export const fileSafe = (text: string): string => text.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/-+/g, '-');

export interface ExportOptions {
  rock?: string;
  classes?: string;
  levels?: string;
}

/** The rock surface asked for: "interface:N" (1-based, top down) or a velocity in m/s; the section's default otherwise. */
function rockSurface(section: ExportSection, rock: string | undefined): RockSurface {
  if (!rock) return defaultRockSurface(section);
  const m = /^interface:(\d+)$/.exec(rock);
  if (m) {
    const index = Number(m[1]) - 1;
    if (!section.interfaces[index]) throw new HttpError(400, 'invalid_rock', `This section has ${section.interfaces.length} interface${section.interfaces.length === 1 ? '' : 's'}: rock=interface:${m[1]} is not one of them.`);
    return { kind: 'interface', index };
  }
  const v = Number(rock);
  if (!(v >= 50 && v <= 10000)) throw new HttpError(400, 'invalid_rock', 'rock must be interface:N or a velocity between 50 and 10000 m/s.');
  return { kind: 'iso', velocity: v };
}

function classes(text: string | undefined): readonly ExcavatabilityClass[] | null {
  if (text === undefined || text === '' || text === 'none') return text === 'none' ? null : WEAVER_1975;
  const parsed = parseClasses(text);
  if (typeof parsed === 'string') throw new HttpError(400, 'invalid_classes', `classes: ${parsed}.`);
  return parsed;
}

function levels(text: string | undefined): number[] | undefined {
  if (!text) return undefined;
  const values = text.split(',').map(Number);
  if (values.length > 50 || values.some((v) => !(v >= 50 && v <= 10000))) throw new HttpError(400, 'invalid_levels', 'levels must be up to 50 velocities between 50 and 10000 m/s, separated by commas.');
  return values;
}

/** The file's bytes, type and name. */
export function writeExport(loaded: LoadedSection, file: ExportFile, options: ExportOptions): { body: string; type: string; name: string } {
  const { section, ctx } = loaded;
  const stem = fileSafe(`${ctx.line}-${section.title.what}`).slice(0, 80);
  switch (file) {
    case 'section.dxf':
      return { body: sectionDxf(section, { colourRange: ctx.velocityColours, levels: levels(options.levels) }), type: 'application/dxf', name: `${stem}.dxf` };
    case 'section.csv':
      return { body: sectionCsv(section), type: 'text/csv; charset=utf-8', name: `${stem}-grid.csv` };
    case 'depth-to-rock.csv':
      return { body: depthToRockCsv(section, rockSurface(section, options.rock), classes(options.classes)), type: 'text/csv; charset=utf-8', name: `${stem}-depth-to-rock.csv` };
    case 'depth-to-rock.json': {
      // The same table for the pages: rows, ties at the holes and the depth to each class.
      const surface = rockSurface(section, options.rock);
      const bands = (classes(options.classes) ?? []).filter((c) => c.from > 0);
      const body = JSON.stringify({
        surface: surfaceName(section, surface),
        interfaces: section.interfaces.map((f) => f.name),
        coverage: section.coverage !== null,
        rows: depthToRock(section, surface).map((r) => ({ ...r, classes: bands.map((b) => rockDepthAt(section, { kind: 'iso', velocity: b.from }, r.x).depth) })),
        classes: bands,
        ties: rockTies(section, surface),
        cautions: [INTERPRETATION_CAUTION, ...(bands.length ? [EXCAVATABILITY_CAUTION] : [])],
      });
      return { body, type: 'application/json', name: `${stem}-depth-to-rock.json` };
    }
    case 'depth-to-rock.geojson': {
      if (!loaded.crsCode || !loaded.lonLat) throw new HttpError(422, 'no_coordinates', loaded.crsCode ? 'This project’s coordinate system converts to longitude/latitude only through a grid file Timefield does not carry, so GeoJSON cannot be written.' : 'GeoJSON needs real-world coordinates: set the project’s coordinate system and give the stations eastings and northings first.');
      const code = loaded.crsCode;
      if (!section.stations.some((s) => s.easting !== undefined)) throw new HttpError(422, 'no_coordinates', 'The stations of this line have no eastings and northings: upload them with the station table first.');
      const body = JSON.stringify(depthToRockGeoJson(section, rockSurface(section, options.rock), (e, n) => toLonLat(code, e, n)));
      return { body, type: 'application/geo+json', name: `${stem}-depth-to-rock.geojson` };
    }
  }
}
