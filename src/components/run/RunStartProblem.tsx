import { ApiError, errorMessage, type ApiIssue } from '../../api/errors';

/** Where an issue points: "line 14, receiver_x" for the pick file, a JSON path otherwise. */
function issuePlace(issue: ApiIssue): string {
  if (typeof issue.line === 'number') {
    return issue.column !== undefined && issue.column !== null ? `Pick file line ${issue.line}, ${issue.column}` : `Pick file line ${issue.line}`;
  }
  const path = Array.isArray(issue.path) ? issue.path.join('.') : (issue.path ?? '');
  return path;
}

/** A lead-in that says what kind of refusal this is, before the server's own sentence. */
function heading(err: unknown): string {
  if (!(err instanceof ApiError)) return 'The run could not be started.';
  if (err.code === 'different_lines') return 'These two do not belong together.';
  if (err.code === 'outside_model') return 'The model does not cover every shot and geophone of this pick set.';
  if (err.code === 'grid_too_large') return 'The model grid is too large to solve.';
  if (err.status === 403) return 'Your role cannot start runs on this project.';
  if (err.status === 400 || err.status === 422) return 'The run was refused.';
  return 'The run could not be started.';
}

/** Why a run was refused, in plain words, with the first few of the server's listed issues (they repeat). */
export function RunStartProblem({ error }: { error: unknown }) {
  const issues = error instanceof ApiError ? error.issues : [];
  const shown = issues.slice(0, 8);
  const lines = shown.map((issue) => {
    const place = issuePlace(issue);
    return place ? `${place}: ${issue.message}` : issue.message;
  });
  // The server's sentence is often its first issue again; say it once.
  const message = errorMessage(error);
  const repeats = shown.some((issue, i) => message === lines[i] || message.endsWith(issue.message));
  return (
    <div role="alert" data-testid="run-start-problem" className="rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-900">
      <p className="font-semibold">{heading(error)}</p>
      {!repeats && <p className="mt-1">{message}</p>}
      {lines.length > 0 && (
        <ul className="mt-2 list-disc pl-5 text-sm">
          {lines.map((line, i) => (
            <li key={i}>{line}</li>
          ))}
        </ul>
      )}
      {issues.length > shown.length && <p className="mt-1 text-sm">…and {issues.length - shown.length} more of the same kind.</p>}
    </div>
  );
}
