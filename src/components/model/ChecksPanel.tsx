/** What stands in the way of saving (errors, each named as the editor labels its field) and what merely looks unusual (warnings). */
import type { ApiIssue } from '../../api/errors';
import type { ModelFile } from '../../../shared/model';
import type { DraftCheck } from '../../../shared/model/edit';
import { fieldLabel, plainIssue } from './issueLabels';

const pathText = (p: ApiIssue['path']): string => (Array.isArray(p) ? p.join('.') : p);

export function ChecksPanel({ check, serverIssues, serverMessage, draft }: { check: DraftCheck; serverIssues: ApiIssue[]; serverMessage: string | null; draft: ModelFile | null }) {
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
                <span className="font-semibold">{fieldLabel(e.path, draft)}</span>: {plainIssue(e.path, e.message)}
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
                  <span className="font-semibold">{fieldLabel(pathText(e.path), draft)}</span>: {plainIssue(pathText(e.path), e.message)}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </div>
  );
}
