import { Router } from 'express';
import { MAX_PICK_FILE_BYTES } from '../../shared/limits';
import { stationTableBody } from '../../shared/schemas/stations';
import { checkStationTable, parseStationCsv, type StationIssue } from '../../shared/stations';
import { dataSource } from '../db/dataSource';
import { SurveyLine } from '../entities';
import { HttpError } from '../http/errors';
import { idempotent } from '../http/idempotency';
import { isMultipart, singleFile } from '../http/upload';
import { authorize } from '../policies/authorize';
import { projectOfLine } from '../policies/scopes';
import { presentLine } from '../presenters/project';
import { importPicks } from '../services/importPicks';
import { listPickSetSummaries } from '../services/lineSummary';
import { listModelVersions } from '../services/models';
import { listLineRuns } from '../services/runResults';
import { listStationRevisions, listStations, replaceStations, stationRevision } from '../services/stations';
import { lonLatConverter, outsideAreaIssues, projectCrs } from '../services/stationCoordinates';

const STATION_FILE_BYTES = 1024 * 1024;

const invalidStations = (issues: StationIssue[]) => {
  const first = issues[0];
  const where = first.line ? `line ${first.line}` : first.row ? `row ${first.row}` : '';
  return new HttpError(
    422,
    'invalid_stations',
    `The station table was not saved: ${[where, first.column].filter(Boolean).join(', ')}${where || first.column ? ': ' : ''}${first.message}.`,
    issues.map((i) => ({ row: i.row || undefined, line: i.line, column: i.column ?? undefined, message: i.message })),
  );
};

export function linesRouter(): Router {
  const r = Router();

  r.get('/lines/:lineId', authorize('line.read', projectOfLine), async (req, res) => {
    const line = await dataSource.getRepository(SurveyLine).findOneByOrFail({ id: req.params.lineId as string });
    const [stations, pickSets, models, runs] = await Promise.all([
      listStations(line.id), listPickSetSummaries(line.id), listModelVersions(line.id), listLineRuns(line.id),
    ]);
    res.json({ ...presentLine(line), myRole: req.access!.role, stations, pickSets, models, runs });
  });

  // JSON array of { station, x, z }, or a CSV file in the multipart field "file".
  r.put('/lines/:lineId/stations', authorize('line.stations.write', projectOfLine), async (req, res, next) => {
    if (isMultipart(req.get('content-type'))) return singleFile(STATION_FILE_BYTES)(req, res, next);
    next();
  }, async (req, res) => {
    let stations;
    const crs = await projectCrs(req.access!.projectId);
    if (req.file) {
      const parsed = parseStationCsv(req.file.buffer.toString('utf8'), { lonLatToMap: lonLatConverter(crs) });
      if (!parsed.ok) throw invalidStations(parsed.issues);
      stations = parsed.stations;
    } else {
      const parsed = stationTableBody.safeParse(req.body);
      if (!parsed.success) {
        throw invalidStations(parsed.error.issues.map((i) => ({
          row: typeof i.path[0] === 'number' ? i.path[0] + 1 : 0,
          column: (['station', 'x', 'z', 'easting', 'northing'].includes(String(i.path[1])) ? i.path[1] : null) as StationIssue['column'],
          message: i.message,
        })));
      }
      const issues = checkStationTable(parsed.data);
      if (issues.length) throw invalidStations(issues);
      stations = parsed.data;
    }
    const outside = outsideAreaIssues(stations, crs);
    if (outside.length) throw invalidStations(outside);
    await replaceStations(req.user!.id, req.access!.projectId, req.params.lineId as string, stations);
    res.json({ stations: await listStations(req.params.lineId as string) });
  });

  // Earlier station tables (each save keeps the one it replaced), newest first.
  r.get('/lines/:lineId/stations/revisions', authorize('line.read', projectOfLine), async (req, res) => {
    res.json(await listStationRevisions(req.params.lineId as string));
  });

  // Bring back an earlier table; the current one is kept as a revision in turn.
  r.post('/lines/:lineId/stations/revisions/:number/restore', authorize('line.stations.write', projectOfLine), async (req, res) => {
    const lineId = req.params.lineId as string;
    const number = Number(req.params.number);
    const stations = Number.isInteger(number) && number >= 1 ? await stationRevision(lineId, number) : null;
    if (!stations) throw new HttpError(404, 'revision_not_found', `This line has no station revision ${req.params.number}.`);
    await replaceStations(req.user!.id, req.access!.projectId, lineId, stations, number);
    res.json({ stations: await listStations(lineId) });
  });

  r.post('/lines/:lineId/picksets', authorize('line.picksets.create', projectOfLine), idempotent(), singleFile(MAX_PICK_FILE_BYTES), async (req, res) => {
    if (!req.file) throw new HttpError(400, 'file_missing', 'Choose a pick file to upload (form field "file").');
    if (/[\u0000-\u001f\u007f]/.test(req.file.originalname ?? '')) {
      throw new HttpError(400, 'bad_file_name', 'The file name contains control characters. Rename the file and upload it again.');
    }
    const name = req.file.originalname?.slice(0, 200) || 'picks.csv';
    const created = await importPicks(req.user!.id, req.access!.projectId, req.params.lineId as string, name, req.file.buffer);
    res.status(201).json(created);
  });

  return r;
}
