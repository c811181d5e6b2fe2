/** The API's error body: `{ error, message, issues? }` (API.md). */
export interface ApiIssue {
  path: string | (string | number)[];
  message: string;
  line?: number;
  /** The server names the pick-file column (server/http/errors.ts). */
  column?: string | number | null;
}

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly issues: ApiIssue[];

  constructor(status: number, code: string, message: string, issues: ApiIssue[] = []) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.issues = issues;
  }
}

export function isApiError(err: unknown, status?: number): err is ApiError {
  return err instanceof ApiError && (status === undefined || err.status === status);
}

/** Words for a status when the body carries no message (e.g. a proxy error page). */
function fallbackMessage(status: number): string {
  if (status === 401) return 'Please sign in again.';
  if (status === 403) return 'Your account is not allowed to do this.';
  if (status === 404) return 'We could not find that.';
  if (status === 429) return 'Too many attempts. Please wait a minute and try again.';
  if (status >= 500) return 'The server ran into a problem. Please try again shortly.';
  return `The request failed (HTTP ${status}).`;
}

/** Build an ApiError from any non-2xx response, whatever its body looks like. */
export async function toApiError(res: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await res.json();
  } catch {
    // Not JSON (HTML error page, empty body): fall back to the status words.
  }
  const obj = (body && typeof body === 'object' ? body : {}) as Record<string, unknown>;
  const message = typeof obj.message === 'string' && obj.message ? obj.message : fallbackMessage(res.status);
  const code = typeof obj.error === 'string' ? obj.error : `http_${res.status}`;
  const issues = Array.isArray(obj.issues) ? (obj.issues as ApiIssue[]) : [];
  return new ApiError(res.status, code, message, issues);
}

/** A readable sentence for any thrown value (network failures included). */
export function errorMessage(err: unknown): string {
  if (err instanceof ApiError) return err.message;
  if (err instanceof TypeError) return 'Could not reach the Timefield server. Check your connection and try again.';
  if (err instanceof Error) return err.message;
  return 'Something went wrong.';
}

/** First segment of an issue path ("members[0].role" → "members"), used to tie issues to inputs. */
export function issueField(issue: ApiIssue): string {
  if (Array.isArray(issue.path)) return String(issue.path[0] ?? '');
  return issue.path.split(/[.[]/)[0] ?? '';
}
