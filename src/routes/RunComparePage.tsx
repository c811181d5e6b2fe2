import type { ReactNode } from 'react';
import { Link, useParams } from 'react-router';
import { useProject } from '../api/projects';
import { lineRuns, useResiduals, useRun, useRunLine } from '../api/runs';
import type { LineRunSummary, RunDetail } from '../api/types';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { runLabel } from '../components/run/compare/CompareChooser';
import { CompareShots, CompareStats } from '../components/run/compare/CompareStats';
import { comparisonHeadline } from '../components/run/compare/compareWords';
import { DifferenceView } from '../components/run/compare/DifferenceView';
import { RUN_STATUS_LABELS } from '../components/run/format';
import { RunCaution } from '../components/run/RunCaution';

function Refusal({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div role="alert" data-testid="compare-refused" className="rounded-lg border border-amber-300 bg-amber-50 px-5 py-4 text-amber-950">
      <p className="text-lg font-semibold">{title}</p>
      <div className="mt-1">{children}</div>
    </div>
  );
}

/** Two runs of the same line: statistics side by side, per-shot RMS, and the change in every pick's residual. */
export function RunComparePage() {
  const { runId = '', otherRunId = '' } = useParams();
  const a = useRun(runId);
  const b = useRun(otherRunId);
  const line = useRunLine(a.data?.lineId);
  const project = useProject(line.data?.projectId ?? '', { enabled: Boolean(line.data?.projectId) });
  const bothDone = a.data?.status === 'done' && b.data?.status === 'done' && a.data.lineId === b.data.lineId;
  const ra = useResiduals(runId, bothDone);
  const rb = useResiduals(otherRunId, bothDone);

  if (a.isPending || b.isPending) return <Loading what="runs" />;
  if (a.isError) return <LoadError error={a.error} what="run" />;
  if (b.isError) return <LoadError error={b.error} what="run to compare with" />;

  const runA = a.data;
  const runB = b.data;
  const runs = line.data ? lineRuns(line.data.runs) : [];
  const summaryOf = (r: RunDetail): LineRunSummary | undefined => runs.find((x) => x.id === r.id);
  const header = (
    <PageHeader
      title="Two runs compared"
      crumbs={[
        { label: 'Projects', to: '/' },
        { label: project.data?.name ?? 'Project', to: line.data ? `/projects/${line.data.projectId}` : undefined },
        { label: line.data?.name ?? 'Line', to: `/lines/${runA.lineId}` },
        { label: 'Run A', to: `/runs/${runA.id}` },
      ]}
    >
      <ul className="space-y-0.5">
        <li>
          <strong>A</strong>: <Link to={`/runs/${runA.id}`}>{summaryOf(runA) ? runLabel(summaryOf(runA)!) : runA.id}</Link>
        </li>
        <li>
          <strong>B</strong>: <Link to={`/runs/${runB.id}`}>{summaryOf(runB) ? runLabel(summaryOf(runB)!) : runB.id}</Link>
        </li>
      </ul>
    </PageHeader>
  );

  let body: ReactNode;
  if (runA.id === runB.id) {
    body = <Refusal title="That is the same run twice.">Choose a different run of this line to compare with.</Refusal>;
  } else if (runA.lineId !== runB.lineId) {
    body = (
      <Refusal title="These runs belong to different survey lines.">
        Residuals only compare pick by pick on the same line. Open <Link to={`/runs/${runA.id}`}>run A</Link> and choose a run of its own line.
      </Refusal>
    );
  } else if (!bothDone) {
    const unfinished = [runA, runB].filter((r) => r.status !== 'done');
    body = (
      <Refusal title="Only finished runs can be compared.">
        {unfinished.map((r) => (
          <p key={r.id}>
            Run {r.id === runA.id ? 'A' : 'B'} is {RUN_STATUS_LABELS[r.status].toLowerCase()}.
          </p>
        ))}
      </Refusal>
    );
  } else {
    const sa = runA.stats!;
    const sb = runB.stats!;
    body = (
      <>
        <p data-testid="compare-sentence" className="mb-2 text-lg font-semibold text-stone-900">
          {comparisonHeadline(sa.rms_ms, sb.rms_ms, runA.pickSetId === runB.pickSetId)}
        </p>
        <ul className="mb-6 list-disc pl-5 text-stone-700">
          {runA.order !== runB.order && (
            <li data-testid="compare-order-note">
              The runs use different solver orders, so part of every difference is the solver's own error rather than the model.
            </li>
          )}
          {runA.pickSetId === runB.pickSetId && runA.pickSetRevision !== runB.pickSetRevision && (
            <li>The runs use different revisions of the pick set (different exclusions), so their statistics cover slightly different picks.</li>
          )}
          {runA.pickSetId !== runB.pickSetId && <li>Only picks of the same shot at the same receiver position are differenced below.</li>}
          {runA.modelId === runB.modelId && <li>Both runs solved the same model version.</li>}
        </ul>
        <section aria-labelledby="cmp-stats" className="mb-10 grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <div>
            <h2 id="cmp-stats" className="mb-3 text-xl font-semibold text-stone-900">
              Statistics side by side
            </h2>
            {sa && sb && <CompareStats a={{ run: runA, stats: sa, summary: summaryOf(runA) }} b={{ run: runB, stats: sb, summary: summaryOf(runB) }} />}
          </div>
          <div>
            <h2 className="mb-3 text-xl font-semibold text-stone-900">By shot</h2>
            <CompareShots a={sa} b={sb} />
          </div>
        </section>
        <section aria-labelledby="cmp-diff">
          <h2 id="cmp-diff" className="mb-1 text-xl font-semibold text-stone-900">
            Change in residual, B − A
          </h2>
          <p className="mb-3 text-stone-600">Where the two models predict different times. With the same picks this is computed A − computed B.</p>
          {(ra.isPending || rb.isPending) && <Loading what="residuals" />}
          {ra.isError && <LoadError error={ra.error} what="residuals of run A" />}
          {rb.isError && <LoadError error={rb.error} what="residuals of run B" />}
          {ra.data && rb.data && <DifferenceView a={ra.data} b={rb.data} />}
        </section>
      </>
    );
  }

  return (
    <>
      <title>{`Runs compared · ${line.data?.name ?? 'line'} · Timefield`}</title>
      {header}
      <RunCaution />
      {body}
    </>
  );
}

export default RunComparePage;
