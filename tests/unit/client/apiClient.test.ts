import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { apiRequest, resetCsrfToken } from '../../../src/api/client';
import { ApiError } from '../../../src/api/errors';

// Contract under test: ../shared/API.md — the CSRF token from GET /api/auth/csrf goes in the
// X-CSRF-Token header of every POST, PUT, PATCH and DELETE; errors are { error, message, issues? }.

type Call = { url: string; method: string; headers: Record<string, string>; body?: string };

function fakeServer(handler: (call: Call, n: number) => Response) {
  const calls: Call[] = [];
  const fetchMock = vi.fn(async (url: string, init: RequestInit = {}) => {
    const call: Call = { url, method: init.method ?? 'GET', headers: (init.headers ?? {}) as Record<string, string>, body: init.body as string | undefined };
    calls.push(call);
    return handler(call, calls.length);
  });
  vi.stubGlobal('fetch', fetchMock);
  return calls;
}

const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

describe('apiRequest', () => {
  beforeEach(() => resetCsrfToken());
  afterEach(() => vi.unstubAllGlobals());

  it('sends no token on GET and the fetched token on POST, fetching it once', async () => {
    let issued = 0;
    const calls = fakeServer((c) => (c.url === '/api/auth/csrf' ? json(200, { token: `t${++issued}` }) : json(200, { ok: true })));
    await apiRequest('/api/projects');
    await apiRequest('/api/projects', { method: 'POST', body: { name: 'a' } });
    await apiRequest('/api/projects/1/members/2', { method: 'DELETE' });
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual(['GET /api/projects', 'GET /api/auth/csrf', 'POST /api/projects', 'DELETE /api/projects/1/members/2']);
    expect(calls[0]!.headers['X-CSRF-Token']).toBeUndefined();
    expect(calls[2]!.headers['X-CSRF-Token']).toBe('t1');
    expect(calls[3]!.headers['X-CSRF-Token']).toBe('t1');
    expect(JSON.parse(calls[2]!.body!)).toEqual({ name: 'a' });
  });

  it('fetches a new token after resetCsrfToken (sign-in and sign-out renew the session)', async () => {
    let issued = 0;
    const calls = fakeServer((c) => (c.url === '/api/auth/csrf' ? json(200, { token: `t${++issued}` }) : new Response(null, { status: 204 })));
    await apiRequest('/api/auth/logout', { method: 'POST' });
    resetCsrfToken();
    await apiRequest('/api/auth/logout', { method: 'POST' });
    const posts = calls.filter((c) => c.method === 'POST');
    expect(posts.map((c) => c.headers['X-CSRF-Token'])).toEqual(['t1', 't2']);
  });

  it('retries once with a fresh token when the server rejects the token, and not more', async () => {
    let issued = 0;
    const calls = fakeServer((c) => {
      if (c.url === '/api/auth/csrf') return json(200, { token: `t${++issued}` });
      return json(403, { error: 'csrf_failed', message: 'The form has expired.' });
    });
    const err = await apiRequest('/api/projects', { method: 'POST', body: {} }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect((err as ApiError).status).toBe(403);
    expect(calls.filter((c) => c.method === 'POST').map((c) => c.headers['X-CSRF-Token'])).toEqual(['t1', 't2']);
  });

  it('does not retry a 403 that is a permission refusal', async () => {
    const calls = fakeServer((c) => (c.url === '/api/auth/csrf' ? json(200, { token: 't' }) : json(403, { error: 'forbidden', message: 'Not allowed.' })));
    await expect(apiRequest('/api/users', { method: 'POST', body: {} })).rejects.toMatchObject({ status: 403, code: 'forbidden', message: 'Not allowed.' });
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(1);
  });

  it('turns the error body into ApiError with its issues', async () => {
    fakeServer((c) =>
      c.url === '/api/auth/csrf'
        ? json(200, { token: 't' })
        : json(400, { error: 'validation_failed', message: 'Check the form.', issues: [{ path: 'site', message: 'Required' }] }),
    );
    await expect(apiRequest('/api/projects', { method: 'POST', body: {} })).rejects.toMatchObject({
      status: 400,
      code: 'validation_failed',
      message: 'Check the form.',
      issues: [{ path: 'site', message: 'Required' }],
    });
  });

  it('gives a readable message when an error response is not JSON', async () => {
    fakeServer(() => new Response('<html>Bad gateway</html>', { status: 502, headers: { 'Content-Type': 'text/html' } }));
    const err = (await apiRequest('/api/projects').catch((e: unknown) => e)) as ApiError;
    expect(err.status).toBe(502);
    expect(err.code).toBe('http_502');
    expect(err.message).toMatch(/server/i);
  });

  it('resolves undefined for 204 No Content', async () => {
    fakeServer((c) => (c.url === '/api/auth/csrf' ? json(200, { token: 't' }) : new Response(null, { status: 204 })));
    await expect(apiRequest('/api/auth/logout', { method: 'POST' })).resolves.toBeUndefined();
  });
});
