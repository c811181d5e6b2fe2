import { hostname } from 'node:os';

/** This worker process's name in the queue and on an ensemble's progress: WORKER_NAME, else host:pid. */
export const WORKER_NAME = process.env.WORKER_NAME ?? `${hostname()}:${process.pid}`;
