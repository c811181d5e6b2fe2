/**
 * The built client: brotli or gzip copies made at build (vite.config.ts) sent when the browser
 * accepts them, hashed files (/assets/…) cached for a year (their names change with their content),
 * everything else — index.html above all — checked on every load so a new deployment shows at once.
 */
import type { Express } from 'express';
import type { ServerResponse } from 'node:http';
import expressStaticGzip from 'express-static-gzip';
import path from 'node:path';

const HASHED = `${path.sep}assets${path.sep}`;
const ONE_YEAR = 'public, max-age=31536000, immutable';
const REVALIDATE = 'no-cache';

function cacheHeaders(res: ServerResponse, file: string): void {
  res.setHeader('Cache-Control', file.includes(HASHED) ? ONE_YEAR : REVALIDATE);
}

export function serveClient(app: Express, clientDir: string): void {
  app.use(
    expressStaticGzip(clientDir, {
      enableBrotli: true,
      orderPreference: ['br', 'gz'],
      index: false,
      serveStatic: { index: false, cacheControl: false, setHeaders: cacheHeaders },
    }),
  );
  // Any other path is a page of the single-page app.
  app.get('/{*splat}', (_req, res) => {
    res.setHeader('Cache-Control', REVALIDATE);
    res.sendFile(path.join(clientDir, 'index.html'));
  });
}
