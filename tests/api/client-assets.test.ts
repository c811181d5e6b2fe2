/**
 * The built client over the wire (issue 17, item 13): a browser that accepts brotli or gzip gets the
 * copy made at build with the matching Content-Encoding, byte for byte the original once decoded
 * (checked with Node's zlib, an outside decoder); hashed files are cached for a year, index.html and
 * the app's page addresses are revalidated on every load. Encodings and caching per RFC 9110 §8.4 and
 * RFC 9111 §5.2.2 (immutable: RFC 8246).
 */
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { brotliCompressSync, brotliDecompressSync, gunzipSync, gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { startTestApp, type TestApp } from './support/app';

describe('client assets: precompressed copies and cache lifetimes', () => {
  let t: TestApp;
  let app: ReturnType<typeof createApp>;
  const script = `export const answer = ${JSON.stringify('x'.repeat(5000))};\n`;

  beforeAll(async () => {
    t = await startTestApp();
    const dir = mkdtempSync(path.join(tmpdir(), 'tf-client-'));
    mkdirSync(path.join(dir, 'assets'));
    writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>Timefield</title>');
    writeFileSync(path.join(dir, 'assets', 'main-Ab12Cd34.js'), script);
    writeFileSync(path.join(dir, 'assets', 'main-Ab12Cd34.js.br'), brotliCompressSync(script));
    writeFileSync(path.join(dir, 'assets', 'main-Ab12Cd34.js.gz'), gzipSync(script));
    app = createApp({ redis: t.redis, pgPool: t.pgPool, queue: t.queue, mailer: t.mailer, clientDir: dir });
  });
  afterAll(async () => {
    await t?.close();
  });

  /** A plain Node request, so no client library decodes the body on our behalf. */
  function raw(url: string, acceptEncoding: string): Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }> {
    return new Promise((resolve, reject) => {
      const server = app.listen(0, '127.0.0.1', () => {
        const { port } = server.address() as AddressInfo;
        http.get({ host: '127.0.0.1', port, path: url, headers: { 'Accept-Encoding': acceptEncoding } }, (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => server.close(() => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) })));
        }).on('error', reject);
      });
    });
  }

  it('sends brotli when accepted, gzip when only that is, plain otherwise — the same bytes once decoded', async () => {
    const br = await raw('/assets/main-Ab12Cd34.js', 'gzip, deflate, br');
    expect(br.status).toBe(200);
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers['content-type']).toMatch(/javascript/);
    expect(br.headers.vary).toMatch(/Accept-Encoding/i);
    expect(brotliDecompressSync(br.body).toString()).toBe(script);
    expect((br.body).length).toBeLessThan(script.length / 10);

    const gz = await raw('/assets/main-Ab12Cd34.js', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gz.body).toString()).toBe(script);

    const plain = await raw('/assets/main-Ab12Cd34.js', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect((plain.body).toString()).toBe(script);
  });

  it('caches hashed assets for a year and revalidates the page itself', async () => {
    const asset = await request(app).get('/assets/main-Ab12Cd34.js').set('Accept-Encoding', 'br');
    expect(asset.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    for (const page of ['/index.html', '/', '/lines/some-line?tab=layers']) {
      const res = await request(app).get(page);
      expect(res.status).toBe(200);
      expect(res.text).toContain('<title>Timefield</title>');
      expect(res.headers['cache-control']).toBe('no-cache');
    }
  });
});
