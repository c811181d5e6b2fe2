import { Router } from 'express';
import { dataSource } from '../db/dataSource';
import { SurveyLine } from '../entities';
import { authorize } from '../policies/authorize';
import { projectOfLine } from '../policies/scopes';
import { presentLine } from '../presenters/project';

export function linesRouter(): Router {
  const r = Router();

  r.get('/lines/:lineId', authorize('line.read', projectOfLine), async (req, res) => {
    const line = await dataSource.getRepository(SurveyLine).findOneByOrFail({ id: req.params.lineId as string });
    // Stations, pick sets, models and runs arrive with their own entities.
    res.json({ ...presentLine(line), stations: [], pickSets: [], models: [], runs: [] });
  });

  return r;
}
