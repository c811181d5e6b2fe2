import { useMemo } from 'react';
import { useParams } from 'react-router';
import { isEnsembleActive, useEnsemble, useEnsembleMembers, useEnsembleSection } from '../api/ensembles';
import { useInversion } from '../api/inversions';
import { useRunLine } from '../api/runs';
import { Loading, LoadError } from '../components/LoadState';
import { Section } from '../components/Section';
import { BandTiesTable } from '../components/ensemble/BandTiesTable';
import { DepthBandTable } from '../components/ensemble/DepthBandTable';
import { EnsembleCaution } from '../components/ensemble/EnsembleCaution';
import { MeanWithBand, ProbabilityChart, SpreadChart } from '../components/ensemble/EnsembleCharts';
import { EnsembleProgress } from '../components/ensemble/EnsembleProgress';
import { EnsembleStatusBadge } from '../components/ensemble/EnsembleStatusBadge';
import { MembersTable } from '../components/ensemble/MembersTable';
import { inversionTitle } from '../components/inversion/InversionHeader';
import { toFloat32 } from '../components/inversion/sectionArrays';
import { PageHeader } from '../components/PageHeader';
import { SectionColoursControl } from '../components/plot/colours/SectionColoursControl';
import { useLineSectionColours } from '../components/plot/colours/useSectionColours';
import { duration, when } from '../components/run/format';
import { canCancelInversions } from '../lib/permissions';
import { accuracyStatement, rockWords, variationWords } from '../../shared/uncertainty/wording';
import { finiteRange } from '../../shared/colour/velocity-scale';

/**
 * One ensemble (/lines/:lineId/ensembles/:ensembleId): live progress over the workers while members
 * run; once combined, the mean with the depth band, the spread, the probability of rock, the band
 * per station and every member. What the band covers stays on the page whatever its state.
 */
export function EnsemblePage() {
  const { lineId = '', ensembleId = '' } = useParams();
  const ensemble = useEnsemble(ensembleId);
  const e = ensemble.data;
  const active = isEnsembleActive(e?.status);
  const members = useEnsembleMembers(ensembleId, e?.status);
  const section = useEnsembleSection(ensembleId, e?.status === 'done');
  const base = useInversion(e?.inversionId ?? '');
  const line = useRunLine(e?.lineId ?? lineId);
  const meanRange = useMemo(() => (section.data ? finiteRange(toFloat32(section.data.mean)) : null), [section.data]);
  const colours = useLineSectionColours(e?.lineId ?? lineId, meanRange);

  if (ensemble.isPending) return <Loading what="ensemble" />;
  if (ensemble.isError || !e) return <LoadError error={ensemble.error} what="ensemble" onRetry={() => void ensemble.refetch()} />;
  const title = e.label || `Ensemble of ${when(e.createdAt)}`;
  const took = duration(e.startedAt, e.finishedAt);
  const varied = variationWords(e.vary, e.rockVelocity);
  return (
    <>
      <title>{`Ensemble · ${line.data?.name ?? 'line'} · Timefield`}</title>
      <PageHeader
        title={title}
        crumbs={[
          { label: 'Projects', to: '/' },
          { label: line.data?.name ?? 'Line', to: `/lines/${e.lineId}?tab=inversions` },
          { label: base.data ? inversionTitle(base.data) : 'Inversion', to: `/lines/${e.lineId}/inversions/${e.inversionId}` },
        ]}
      >
        <p className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <EnsembleStatusBadge status={e.status} />
          <span>
            {e.members} members of the inversion, seed {e.seed}; varied: {varied.join('; ') || 'nothing'}
          </span>
        </p>
        <p className="mt-1 text-sm text-stone-600">
          Started {when(e.createdAt)}
          {took && <> · {e.status === 'done' ? 'combined' : 'stopped'} after {took}</>}
        </p>
      </PageHeader>
      <EnsembleCaution />
      {(active || e.status === 'cancelled') && <EnsembleProgress ensemble={e} canCancel={active && canCancelInversions(line.data?.myRole)} />}
      {e.status === 'failed' && (
        <p role="alert" className="mb-8 rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-900" data-testid="ensemble-error">
          {e.error ?? 'The ensemble failed.'}
        </p>
      )}
      {e.status === 'done' && e.stats && (
        <Section title="How sure is the depth to rock?">
          <p className="mb-2 max-w-prose text-lg text-stone-900" data-testid="ensemble-accuracy">
            {section.data ? accuracyStatement(section.data.bands, section.data.rockVelocity, section.data.used) : 'Loading the band…'}
          </p>
          <p className="mb-4 max-w-prose text-stone-700" data-testid="ensemble-fit">
            {e.stats.used} of {e.members} members used; {e.stats.excluded} left out for explaining the picks worse than χ² {e.stats.maxChi2.toFixed(2)}
            {e.stats.baseChi2 !== null && e.stats.maxChi2 > 1.2 && <> (the inversion itself reached {e.stats.baseChi2.toFixed(2)}; members may fit up to 25 % worse)</>}
            {e.stats.failed > 0 && <>; {e.stats.failed} failed</>}. Median member took {e.stats.medianMemberSeconds?.toFixed(1) ?? '—'} s.
          </p>
        </Section>
      )}
      {section.isError && <LoadError error={section.error} what="combined section" onRetry={() => void section.refetch()} />}
      {section.data && e.status === 'done' && (
        <>
          <Section title="Sections" description={`Grey: ground fewer than half the members cover with rays. Band: depth of ${rockWords(section.data.rockVelocity)}, 5–95 % filled, median dashed.`}>
            <div className="mb-3">
              <SectionColoursControl colours={colours} />
            </div>
            <div className="grid grid-cols-1 gap-4 xl:grid-cols-2">
              <MeanWithBand section={section.data} colours={colours.range} />
              <SpreadChart section={section.data} />
            </div>
            <div className="mt-4 grid grid-cols-1 gap-4 xl:grid-cols-2">
              <ProbabilityChart section={section.data} />
            </div>
          </Section>
          <Section title="Depth band per station">
            <DepthBandTable section={section.data} ensemble={e} title={`${line.data?.name ?? 'line'} ${title}`} />
            <BandTiesTable lineId={e.lineId} section={section.data} />
          </Section>
        </>
      )}
      <Section title="Members">
        {members.data ? <MembersTable members={members.data} maxChi2={e.stats?.maxChi2 ?? null} /> : members.isError ? <LoadError error={members.error} what="members" /> : <Loading what="members" />}
      </Section>
    </>
  );
}

export default EnsemblePage;
