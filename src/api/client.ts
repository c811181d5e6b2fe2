import { ApiError, toApiError } from './errors';

/**
 * The one fetch wrapper: same-origin cookies, JSON in and out, and the CSRF token
 * on every state-changing request. The token belongs to the session, and the
 * session is renewed on sign-in and sign-out, so callers reset it then.
 */

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
let csrfToken: Promise<string> | null = null;

async function fetchCsrfToken(): Promise<string> {
  const res = await fetch('/api/auth/csrf', { credentials: 'same-origin', headers: { Accept: 'application/json' } });
  if (!res.ok) throw await toApiError(res);
  const body = (await res.json()) as { token?: unknown };
  if (typeof body.token !== 'string') throw new ApiError(500, 'csrf_missing', 'The server did not hand out a security token.');
  return body.token;
}

function getCsrfToken(): Promise<string> {
  if (!csrfToken) {
    csrfToken = fetchCsrfToken();
    csrfToken.catch(() => {
      csrfToken = null; // let the next request try again
    });
  }
  return csrfToken;
}

/** Forget the token; the next unsafe request fetches a fresh one. */
export function resetCsrfToken(): void {
  csrfToken = null;
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  /** Sent as Idempotency-Key: a repeat of the same submission gets the first answer (server/http/idempotency.ts). */
  idempotencyKey?: string;
}

async function send(path: string, method: string, body: unknown, signal?: AbortSignal, idempotencyKey?: string): Promise<Response> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';
  if (idempotencyKey) headers['Idempotency-Key'] = idempotencyKey;
  if (UNSAFE.has(method)) headers['X-CSRF-Token'] = await getCsrfToken();
  return fetch(path, {
    method,
    headers,
    credentials: 'same-origin',
    body: body === undefined ? undefined : JSON.stringify(body),
    signal,
  });
}

/** Call the API; resolves with the parsed JSON (undefined for 204) or throws ApiError. */
export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const method = options.method ?? 'GET';
  let res = await send(path, method, options.body, options.signal, options.idempotencyKey);
  // A stale token (session expired or renewed elsewhere) earns one retry with a fresh token.
  if (res.status === 403 && UNSAFE.has(method)) {
    const err = await toApiError(res.clone());
    if (err.code.toLowerCase().includes('csrf')) {
      resetCsrfToken();
      res = await send(path, method, options.body, options.signal, options.idempotencyKey);
    }
  }
  if (!res.ok) throw await toApiError(res);
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

export interface UploadOptions {
  method?: 'POST' | 'PUT';
  /** Called with the fraction of the body sent so far (0…1). */
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
  idempotencyKey?: string;
}

/** Parse an XMLHttpRequest's answer into the same ApiError that fetch callers get. */
function xhrError(xhr: XMLHttpRequest): Promise<ApiError> {
  const type = xhr.getResponseHeader('Content-Type') ?? 'text/plain';
  return toApiError(new Response(xhr.status === 0 ? null : xhr.responseText, { status: xhr.status || 500, headers: { 'Content-Type': type } }));
}

function sendForm(path: string, form: FormData, token: string, options: UploadOptions): Promise<XMLHttpRequest> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(options.method ?? 'POST', path);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader('X-CSRF-Token', token);
    if (options.idempotencyKey) xhr.setRequestHeader('Idempotency-Key', options.idempotencyKey);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) options.onProgress?.(e.loaded / e.total);
    };
    xhr.onload = () => resolve(xhr);
    // A network failure surfaces as the same TypeError fetch would throw, so errorMessage() words it.
    xhr.onerror = () => reject(new TypeError('Network request failed'));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    options.signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

/**
 * Multipart upload with progress (fetch cannot report upload progress). Same CSRF
 * handling as apiRequest, including one retry when the token has gone stale.
 */
export async function apiUpload<T>(path: string, form: FormData, options: UploadOptions = {}): Promise<T> {
  let xhr = await sendForm(path, form, await getCsrfToken(), options);
  if (xhr.status === 403) {
    const err = await xhrError(xhr);
    if (err.code.toLowerCase().includes('csrf')) {
      resetCsrfToken();
      xhr = await sendForm(path, form, await getCsrfToken(), options);
    }
  }
  if (xhr.status < 200 || xhr.status >= 300) throw await xhrError(xhr);
  return (xhr.responseText ? JSON.parse(xhr.responseText) : undefined) as T;
}
