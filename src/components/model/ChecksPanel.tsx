/** What stands in the way of saving (errors, each with its JSON path) and what merely looks unusual (warnings). */
import type { ApiIssue } from '../../api/errors';
import type { DraftCheck } from '../../../shared/model/edit';

const pathText = (p: ApiIssue['path']): string => (Array.isArray(p) ? p.join('.') : p);

export function ChecksPanel({ check, serverIssues, serverMessage }: { check: DraftCheck; serverIssues: ApiIssue[]; serverMessage: string | null }) {
  const { errors, warnings } = check;
  return (
    <div data-testid="checks" className="space-y-3 text-sm">
      {errors.length === 0 && warnings.length === 0 && !serverMessage && (
        <p data-testid="checks-ok" className="text-stone-700">
          No problems: the model passes the same checks the server runs.
        </p>
      )}
      {errors.length > 0 && (
        <div role="alert" data-testid="check-errors" className="rounded-md border border-red-300 bg-red-50 px-3 py-2 text-red-900">
          <p className="font-semibold">
            {errors.length === 1 ? '1 problem' : `${errors.length} problems`} to fix before saving:
          </p>
          <ul className="mt-1 list-disc space-y-0.5 pl-5">
            {errors.slice(0, 30).map((e, i) => (
              <li key={i}>
                <code className="font-mono text-xs">{e.path}</code>: {e.message}
              </li>
            ))}
          </ul>
        </div>
      )}
      {warnings.length > 0 && (
        <div data-testid="check-warnings" className="rounded-md border border-amber-300 bg-amber-50 px-3 py-2 text-amber-950">
          <p className="font-semibold">Worth a second look (saving is still allowed):</p>
          <ul className="mt-1 list-disc space-y-0.5 pl-5">
            {warnings.map((w, i) => (
              <li key={i}>{w}</li>
            ))}
          </ul>
        </div>
      )}
      {serverMessage && (
        <div role="alert" data-testid="server-issues" className="rounded-md border border-red-300 bg-red-50 px-3 py-2 text-red-900">
          <p className="font-semibold">{serverMessage}</p>
          {serverIssues.length > 0 && (
            <ul className="mt-1 list-disc space-y-0.5 pl-5">
              {serverIssues.slice(0, 30).map((e, i) => (
                <li key={i}>
                  <code className="font-mono text-xs">{pathText(e.path)}</code>: {e.message}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </div>
  );
}
