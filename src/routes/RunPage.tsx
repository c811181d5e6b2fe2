import { useParams } from 'react-router';
import { isRunActive, lineRuns, useRun, useRunLine } from '../api/runs';
import { Loading, LoadError } from '../components/LoadState';
import { canStartRuns } from '../components/run/StartRunForm';
import { RunOutcome } from '../components/run/progress/RunOutcome';
import { RunProgress } from '../components/run/progress/RunProgress';
import { RunCaution } from '../components/run/RunCaution';
import { RunHeader } from '../components/run/RunHeader';
import { RunResults } from '../components/run/RunResults';
import { Disclosure } from '../components/Disclosure';
import { StartReportForm } from '../components/reports/StartReportForm';

/**
 * One forward run: live progress while it is queued or running, a plain message if it failed or
 * was cancelled, and once done the summary, verdict and result views. The caution stays on the page.
 */
export function RunPage() {
  const { runId = '' } = useParams();
  const run = useRun(runId);
  const line = useRunLine(run.data?.lineId);

  if (run.isPending) return <Loading what="run" />;
  if (run.isError) return <LoadError error={run.error} what="run" onRetry={() => void run.refetch()} />;

  const r = run.data;
  const summary = line.data ? lineRuns(line.data.runs).find((x) => x.id === r.id) : undefined;
  return (
    <>
      <title>{`Run ${summary ? `${summary.model.name} v${summary.model.version}` : ''} · ${line.data?.name ?? 'line'} · Timefield`}</title>
      <RunHeader run={r} line={line.data} summary={summary} />
      <RunCaution />
      {isRunActive(r.status) && <RunProgress run={r} canCancel={canStartRuns(line.data?.myRole)} />}
      {(r.status === 'failed' || r.status === 'cancelled') && <RunOutcome run={r} />}
      {r.status === 'done' && r.stats && canStartRuns(line.data?.myRole) && (
        <div className="mb-6">
          <Disclosure label="Make a report of this run" testId="make-report-toggle">
            {() => <StartReportForm source={{ runId: r.id, shotIds: r.stats!.by_shot.map((s) => s.shotId) }} />}
          </Disclosure>
        </div>
      )}
      {r.status === 'done' && r.stats && <RunResults run={r} stats={r.stats} line={line.data} />}
      {r.status === 'done' && !r.stats && (
        <p role="alert" className="rounded-md border border-amber-300 bg-amber-50 px-4 py-3 text-amber-900">
          This run is marked finished but has no statistics stored. Start it again from the line.
        </p>
      )}
    </>
  );
}

export default RunPage;
