import express, { type RequestHandler } from 'express';
import { checkBodyShape } from './body-shape';

/** Routes whose JSON bodies may be large (a model file with a raw velocity grid: tens of MB). */
const LARGE_BODY_ROUTE = /^\/api\/lines\/[^/]+\/models\/?$/;

const small = express.json({ limit: '1mb' });

/**
 * Every JSON body up to 1 MB, parsed before the session so CSRF and policies can read it. The
 * large-body route is skipped here: its router parses it with `largeJsonBody` only after the
 * caller is signed in, has passed CSRF and is allowed, so an anonymous 60 MB body is never read.
 */
export const smallJsonBody: RequestHandler = (req, res, next) => (LARGE_BODY_ROUTE.test(req.path) ? next() : small(req, res, next));

/** For the large-body route, after authorize(): up to 64 MB, then the same shape check as every body. */
export const largeJsonBody: RequestHandler[] = [express.json({ limit: '64mb' }), checkBodyShape];
