import { Router } from 'express';
import { picksFromRecordsBody, recordGeometryBody } from '../../shared/schemas/records';
import { MAX_RECORD_UPLOAD_BYTES } from '../../shared/limits';
import { HttpError } from '../http/errors';
import { parse } from '../http/parse';
import { singleFile } from '../http/upload';
import { authorize } from '../policies/authorize';
import { projectOfLine, projectOfRecord } from '../policies/scopes';
import { deleteRecord, listRecords, picksFromRecords, recordDetail, recordFile, storeRecord, updateRecordGeometry } from '../services/records';

// One record per request, so the page shows progress and a refusal per file; MAX_RECORD_UPLOAD_BYTES
// (64 MB) covers a 48-channel record of 16 000 float64 samples a trace several times over (larger
// files are almost always a whole survey in one SEG-Y, which should be split).

export function recordsRouter(): Router {
  const r = Router();

  r.get('/lines/:lineId/records', authorize('line.records.read', projectOfLine), async (req, res) => {
    res.json(await listRecords(req.params.lineId as string));
  });

  r.post('/lines/:lineId/records', authorize('line.records.create', projectOfLine), singleFile(MAX_RECORD_UPLOAD_BYTES, 'Upload one shot record per file.'), async (req, res) => {
    if (!req.file) throw new HttpError(400, 'no_file', 'Send the record in the form field "file".');
    res.status(201).json(await storeRecord(req.user!.id, req.access!.projectId, req.params.lineId as string, req.file.originalname, req.file.buffer));
  });

  r.get('/records/:recordId', authorize('record.read', projectOfRecord), async (req, res) => {
    res.json(await recordDetail(req.params.recordId as string));
  });

  // The original bytes, for the pages to read with shared/records (samples never go through JSON).
  r.get('/records/:recordId/file', authorize('record.read', projectOfRecord), async (req, res) => {
    const { fileName, bytes } = await recordFile(req.params.recordId as string);
    res.attachment(fileName).type('application/octet-stream').send(bytes);
  });

  r.patch('/records/:recordId', authorize('record.update', projectOfRecord), async (req, res) => {
    res.json(await updateRecordGeometry(req.user!.id, req.access!.projectId, req.params.recordId as string, parse(recordGeometryBody, req.body)));
  });

  r.delete('/records/:recordId', authorize('record.update', projectOfRecord), async (req, res) => {
    await deleteRecord(req.user!.id, req.access!.projectId, req.params.recordId as string);
    res.status(204).end();
  });

  // Picks made on the records, saved as a new pick set of the line (the same checks as a pick file).
  r.post('/lines/:lineId/picksets/from-records', authorize('line.picksets.create', projectOfLine), async (req, res) => {
    res.status(201).json(await picksFromRecords(req.user!.id, req.access!.projectId, req.params.lineId as string, parse(picksFromRecordsBody, req.body)));
  });

  return r;
}
