import { useEffect, useId, useState } from 'react';
import { readFileText } from './readFileText';

export interface FileIssue {
  line?: number | null;
  column?: string | null;
  message: string;
}

/** "line 14, time_ms: … is not a number", the way FORMATS.md words file errors. */
export function issueText(issue: FileIssue): string {
  const where = [issue.line ? `line ${issue.line}` : '', issue.column ?? ''].filter(Boolean).join(', ');
  return where ? `${where}: ${issue.message}` : issue.message;
}

const MAX_LISTED = 100;
const CONTEXT = 2; // lines shown either side of a problem line
const MAX_CHARS = 160;

/** Make control characters and stray bytes visible instead of letting them garble the page. */
function printable(line: string): string {
  // eslint-disable-next-line no-control-regex
  const clean = line.replace(/[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/g, '·');
  return clean.length > MAX_CHARS ? `${clean.slice(0, MAX_CHARS)}…` : clean;
}

/** Merge the windows around problem lines into blocks of consecutive line numbers. */
function excerptBlocks(problemLines: number[], lineCount: number): [number, number][] {
  const blocks: [number, number][] = [];
  for (const n of [...new Set(problemLines)].sort((a, b) => a - b)) {
    const from = Math.max(1, n - CONTEXT);
    const to = Math.min(lineCount, n + CONTEXT);
    if (from > to) continue;
    const last = blocks.at(-1);
    if (last && from <= last[1] + 1) last[1] = Math.max(last[1], to);
    else blocks.push([from, to]);
  }
  return blocks;
}

/**
 * A rejected file's problems, each linked to the offending line in an excerpt of the
 * file itself (read in the browser, so it is exactly what the user chose).
 */
export function FileProblems({ file, summary, issues, testId }: { file: File | null; summary: string; issues: FileIssue[]; testId?: string }) {
  const prefix = useId().replace(/[^a-zA-Z0-9_-]/g, '');
  const [lines, setLines] = useState<string[] | null>(null);
  useEffect(() => {
    let live = true;
    setLines(null);
    if (file) {
      readFileText(file)
        .then((text) => live && setLines(text.replace(/\r\n?/g, '\n').replace(/\n$/, '').split('\n')))
        .catch(() => live && setLines([]));
    }
    return () => {
      live = false;
    };
  }, [file]);

  const listed = issues.slice(0, MAX_LISTED);
  const problemLines = listed.map((i) => i.line).filter((n): n is number => typeof n === 'number' && n > 0);
  const blocks = lines ? excerptBlocks(problemLines, lines.length) : [];
  const flagged = new Set(problemLines);

  function jump(n: number) {
    const el = document.getElementById(`${prefix}-line-${n}`);
    el?.scrollIntoView({ block: 'center', behavior: 'smooth' });
    el?.focus({ preventScroll: true });
  }

  return (
    <div role="alert" data-testid={testId} className="rounded-lg border border-red-300 bg-red-50 px-5 py-4 text-red-950">
      {/* With a list below, the server's sentence (which quotes the first problem) would only repeat it. */}
      <p className="font-semibold">{listed.length > 0 ? `${file?.name ?? 'The file'} was not stored.` : summary}</p>
      {listed.length > 0 && (
        <>
          <p className="mt-1 text-red-900">
            {issues.length === 1 ? 'One problem' : `${issues.length} problems`} found. Nothing was stored; correct the file and upload it again.
          </p>
          <ol data-testid={testId ? `${testId}-list` : undefined} className="mt-2 list-disc space-y-0.5 pl-5">
            {listed.map((issue, i) => (
              <li key={i}>
                {issue.line && lines && issue.line <= lines.length ? (
                  <a
                    href={`#${prefix}-line-${issue.line}`}
                    onClick={(e) => {
                      e.preventDefault();
                      jump(issue.line as number);
                    }}
                    className="text-red-900 underline"
                  >
                    {issueText(issue)}
                  </a>
                ) : (
                  issueText(issue)
                )}
              </li>
            ))}
          </ol>
          {issues.length > MAX_LISTED && <p className="mt-1 text-sm">…and {issues.length - MAX_LISTED} more.</p>}
        </>
      )}
      {lines && blocks.length > 0 && (
        <div className="mt-4">
          <p className="mb-1 text-sm font-semibold text-stone-800">From {file?.name ?? 'the file'}:</p>
          <div data-testid={testId ? `${testId}-preview` : undefined} className="max-h-80 overflow-auto rounded-md border border-stone-300 bg-white font-mono text-sm text-stone-800">
            {blocks.map(([from, to], b) => (
              <div key={from} className={b > 0 ? 'border-t border-dashed border-stone-300' : ''}>
                {lines.slice(from - 1, to).map((text, k) => {
                  const n = from + k;
                  const bad = flagged.has(n);
                  return (
                    <div
                      key={n}
                      id={bad ? `${prefix}-line-${n}` : undefined}
                      tabIndex={bad ? -1 : undefined}
                      className={`flex whitespace-pre ${bad ? 'bg-red-100 font-semibold text-red-950' : ''}`}
                    >
                      <span className="w-14 shrink-0 select-none border-r border-stone-200 pr-2 text-right text-stone-500">{n}</span>
                      <span className="pl-3">{printable(text) || ' '}</span>
                    </div>
                  );
                })}
              </div>
            ))}
          </div>
        </div>
      )}
    </div>
  );
}
