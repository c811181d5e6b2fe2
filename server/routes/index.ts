import type { Router } from 'express';
import type { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import { authRouter } from './auth';
import { healthRouter } from './health';
import { linesRouter } from './lines';
import { modelsRouter } from './models';
import { pickSetsRouter } from './pickSets';
import { recordsRouter } from './records';
import { boreholesRouter } from './boreholes';
import { runsRouter } from './runs';
import { ensemblesRouter } from './ensembles';
import { inversionsRouter } from './inversions';
import { reportsRouter } from './reports';
import { adminRouter } from './admin';
import { organisationRouter } from './organisation';
import type { Mailer } from '../mail/mailer';
import { projectsRouter } from './projects';
import { exportsRouter } from './exports';
import { usersRouter } from './users';

/** Every router mounted under /api. The route × role test walks exactly this list. */
export function apiRouters(redis: Redis, queue: Queue, mailer: Mailer): Router[] {
  return [healthRouter(redis, queue), authRouter(redis), usersRouter(mailer), projectsRouter(), linesRouter(), pickSetsRouter(), recordsRouter(), boreholesRouter(), modelsRouter(), runsRouter(queue), inversionsRouter(queue), ensemblesRouter(queue), reportsRouter(queue, mailer), adminRouter(), organisationRouter(), exportsRouter()];
}
