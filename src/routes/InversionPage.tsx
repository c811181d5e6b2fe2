import { useParams } from 'react-router';
import { isInversionActive, useInversion, useLineInversions } from '../api/inversions';
import { useRunLine } from '../api/runs';
import { Loading, LoadError } from '../components/LoadState';
import { Section } from '../components/Section';
import { CompareWithChooser } from '../components/inversion/CompareWithChooser';
import { ConvergenceChart } from '../components/inversion/ConvergenceChart';
import { InversionHeader } from '../components/inversion/InversionHeader';
import { InversionOutcome } from '../components/inversion/InversionOutcome';
import { InversionProgress } from '../components/inversion/InversionProgress';
import { InversionResults } from '../components/inversion/InversionResults';
import { InversionSummary } from '../components/inversion/InversionSummary';
import { SaveModelPanel } from '../components/inversion/SaveModelPanel';
import { SettingsList } from '../components/inversion/SettingsList';
import { TomographyCaution } from '../components/inversion/TomographyCaution';
import { canCancelInversions, canRunInversions } from '../lib/permissions';
import { canStartRuns } from '../components/run/StartRunForm';
import { Disclosure } from '../components/Disclosure';
import { StartReportForm } from '../components/reports/StartReportForm';
import { DEFAULT_COVERAGE_THRESHOLD_M } from '../components/inversion/coverageMask';
import { InversionEnsemblesPanel } from '../components/ensemble/InversionEnsemblesPanel';

/**
 * One inversion (/lines/:lineId/inversions/:inversionId): live progress and convergence while it runs,
 * a plain message if it failed or was cancelled, and once done the fit, the final section with its
 * checks, the residuals, the recorded settings and "save as model version". The limits of tomography
 * stay on the page whatever its state.
 */
export function InversionPage() {
  const { lineId = '', inversionId = '' } = useParams();
  const inversion = useInversion(inversionId);
  const line = useRunLine(inversion.data?.lineId ?? lineId);
  const done = inversion.data?.status === 'done';
  const list = useLineInversions(done ? (inversion.data?.lineId ?? '') : '');

  if (inversion.isPending) return <Loading what="inversion" />;
  if (inversion.isError) return <LoadError error={inversion.error} what="inversion" onRetry={() => void inversion.refetch()} />;

  const inv = inversion.data;
  const mayAct = canRunInversions(line.data?.myRole);
  return (
    <>
      <title>{`Inversion · ${line.data?.name ?? 'line'} · Timefield`}</title>
      <InversionHeader inversion={inv} line={line.data} />
      <TomographyCaution />
      {isInversionActive(inv.status) && <InversionProgress inversion={inv} canCancel={canCancelInversions(line.data?.myRole)} />}
      {(inv.status === 'failed' || inv.status === 'cancelled') && (
        <>
          <InversionOutcome inversion={inv} />
          {inv.history.length > 0 && (
            <Section title="Convergence before it stopped">
              <ConvergenceChart history={inv.history} maxIterations={inv.settings.maxIterations} />
            </Section>
          )}
        </>
      )}
      {done && inv.stats && (
        <>
          <InversionSummary stats={inv.stats} />
          <div className="mb-8">
            <SaveModelPanel inversion={inv} canSave={mayAct} />
          </div>
          {canStartRuns(line.data?.myRole) && (
            <div className="mb-8">
              <Disclosure label="Make a report of this inversion" testId="make-inversion-report-toggle">
                {() => <StartReportForm source={{ inversionId: inv.id, coverageThreshold: DEFAULT_COVERAGE_THRESHOLD_M }} />}
              </Disclosure>
            </div>
          )}
          <Section title="Convergence">
            <div className="rounded-lg border border-stone-200 bg-white p-4">
              <ConvergenceChart history={inv.history} maxIterations={inv.settings.maxIterations} />
            </div>
          </Section>
          <Section title="Results">
            <InversionResults inversion={inv} lineName={line.data?.name ?? 'line'} />
          </Section>
          <Section title="Uncertainty">
            <InversionEnsemblesPanel inversion={inv} canStart={mayAct} />
          </Section>
          {line.data && list.data && (
            <Section title="Compare">
              <CompareWithChooser inversion={inv} inversions={list.data} line={line.data} />
            </Section>
          )}
        </>
      )}
      {done && !inv.stats && (
        <p role="alert" className="mb-8 rounded-md border border-amber-300 bg-amber-50 px-4 py-3 text-amber-900">
          This inversion is marked finished but has no statistics stored. Start it again from the line.
        </p>
      )}
      <Section title="Settings as recorded">
        <SettingsList inversion={inv} />
      </Section>
    </>
  );
}

export default InversionPage;
