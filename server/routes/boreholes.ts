import { Router } from 'express';
import { parseBoreholeCsv } from '../../shared/boreholes';
import { boreholeBody } from '../../shared/schemas/boreholes';
import { HttpError } from '../http/errors';
import { parse } from '../http/parse';
import { singleFile } from '../http/upload';
import { authorize } from '../policies/authorize';
import { projectOfBorehole, projectOfLine } from '../policies/scopes';
import { createBorehole, createBoreholesFromFile, deleteBorehole, listBoreholes, updateBorehole } from '../services/boreholes';

/** A borehole file is a few kB; 1 MB holds thousands of contacts. */
const BOREHOLE_FILE_BYTES = 1024 * 1024;

export function boreholesRouter(): Router {
  const r = Router();

  r.get('/lines/:lineId/boreholes', authorize('line.boreholes.read', projectOfLine), async (req, res) => {
    res.json(await listBoreholes(req.params.lineId as string));
  });

  r.post('/lines/:lineId/boreholes', authorize('line.boreholes.create', projectOfLine), async (req, res) => {
    res.status(201).json(await createBorehole(req.user!.id, req.access!.projectId, req.params.lineId as string, parse(boreholeBody, req.body)));
  });

  r.post('/lines/:lineId/boreholes/file', authorize('line.boreholes.create', projectOfLine), singleFile(BOREHOLE_FILE_BYTES, 'Split the holes over several files.'), async (req, res) => {
    if (!req.file) throw new HttpError(400, 'no_file', 'Send the borehole CSV in the form field "file".');
    const fileName = req.file.originalname;
    const parsed = parseBoreholeCsv(req.file.buffer.toString('utf8'));
    if (!parsed.ok) {
      const first = parsed.issues[0];
      const where = [first.line ? `line ${first.line}` : '', first.column ?? ''].filter(Boolean).join(', ');
      throw new HttpError(422, 'invalid_boreholes', `${fileName} was not stored: ${where ? `${where}: ` : ''}${first.message}`,
        parsed.issues.map((i) => ({ line: i.line ?? undefined, column: i.column ?? undefined, message: i.message })));
    }
    const boreholes = await createBoreholesFromFile(req.user!.id, req.access!.projectId, req.params.lineId as string, fileName, parsed.boreholes);
    res.status(201).json({ created: boreholes.length, boreholes });
  });

  r.put('/boreholes/:boreholeId', authorize('borehole.update', projectOfBorehole), async (req, res) => {
    res.json(await updateBorehole(req.user!.id, req.access!.projectId, req.params.boreholeId as string, parse(boreholeBody, req.body)));
  });

  r.delete('/boreholes/:boreholeId', authorize('borehole.update', projectOfBorehole), async (req, res) => {
    await deleteBorehole(req.user!.id, req.access!.projectId, req.params.boreholeId as string);
    res.status(204).end();
  });

  return r;
}
