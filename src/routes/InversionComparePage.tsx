import { useMemo, useState, type ReactNode } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import type { InversionSectionView, InversionView } from '../../shared/schemas/inversions';
import { useInversion, useInversionResiduals, useInversionSection } from '../api/inversions';
import { lineRuns, useModelGrid, useResiduals, useRun, useRunLine, useRunModel, useRunShots } from '../api/runs';
import type { LineDetail, RunDetail } from '../api/types';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { Section } from '../components/Section';
import { parseCompareParam, type CompareTarget } from '../components/inversion/CompareWithChooser';
import { DEFAULT_COVERAGE_THRESHOLD_M, thresholdCeiling } from '../components/inversion/coverageMask';
import { InversionSectionCanvas, type InversionSectionScene } from '../components/inversion/InversionSectionCanvas';
import { inversionTitle } from '../components/inversion/InversionHeader';
import { SectionColoursControl } from '../components/plot/colours/SectionColoursControl';
import { useLineSectionColours } from '../components/plot/colours/useSectionColours';
import { SectionControls } from '../components/inversion/SectionControls';
import { SectionLegend } from '../components/inversion/SectionLegend';
import { TomographyCaution } from '../components/inversion/TomographyCaution';
import { modelRange, padScene, sharedRange, unionExtent, useModelScene, type Extent } from '../components/inversion/compareScenes';
import { coveredRange, toFloat32 } from '../components/inversion/sectionArrays';
import { useSectionArrays, useSectionScene } from '../components/inversion/useSectionScene';
import { runLabel } from '../components/run/compare/CompareChooser';
import { DifferenceView } from '../components/run/compare/DifferenceView';
import { ms, num } from '../components/run/format';
import { useElementWidth } from '../components/run/useElementWidth';
import { useProject } from '../api/projects';

interface SideProps {
  letter: 'A' | 'B';
  /** Both sides are drawn over this stretch of line and depth (null until both grids are known). */
  extent: Extent | null;
  title: string;
  to: string;
  chi2: number | null | undefined;
  rmsMs: number | null | undefined;
  scene: InversionSectionScene | null;
  exaggeration: number;
  note?: ReactNode;
}

function Side({ letter, extent, title, to, chi2, rmsMs, scene, exaggeration, note }: SideProps) {
  const { ref, width } = useElementWidth<HTMLDivElement>(600);
  const shown = useMemo(() => (scene && extent ? padScene(scene, extent) : scene), [scene, extent]);
  return (
    <div data-testid={`compare-side-${letter}`} className="min-w-0">
      <h3 className="text-lg font-semibold text-stone-900">
        {letter}: <Link to={to}>{title}</Link>
      </h3>
      <p className="mb-2 text-sm tabular-nums text-stone-700">
        χ² per datum {num(chi2)} · RMS {ms(rmsMs)}
        {note}
      </p>
      <div ref={ref} className="overflow-x-auto rounded-lg border border-stone-200 bg-white p-2">
        {shown ? (
          <InversionSectionCanvas scene={shown} width={Math.max(300, width - 16)} exaggeration={exaggeration} label={`Section ${letter}: ${title}`} testId={`compare-canvas-${letter}`} />
        ) : (
          <div role="status" className="flex h-48 items-center justify-center text-stone-600">
            Loading the section…
          </div>
        )}
      </div>
    </div>
  );
}

/**
 * An inversion beside another inversion or a forward run of the same line: both sections on one colour
 * scale, the same coverage threshold and exaggeration, their fit, and the change in every pick's residual.
 */
export function InversionComparePage() {
  const { lineId = '', inversionId = '' } = useParams();
  const [params] = useSearchParams();
  const target = parseCompareParam(params.get('with'));
  const a = useInversion(inversionId);
  const line = useRunLine(a.data?.lineId ?? lineId);
  if (a.isPending) return <Loading what="inversion" />;
  if (a.isError) return <LoadError error={a.error} what="inversion" />;
  if (!target) {
    return (
      <Refusal title="Nothing to compare with.">
        Choose what to compare from <Link to={`/lines/${a.data.lineId}/inversions/${a.data.id}`}>the inversion's page</Link>.
      </Refusal>
    );
  }
  return <Comparison inversion={a.data} target={target} line={line.data} />;
}

function Refusal({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div role="alert" data-testid="compare-refused" className="rounded-lg border border-amber-300 bg-amber-50 px-5 py-4 text-amber-950">
      <p className="text-lg font-semibold">{title}</p>
      <div className="mt-1">{children}</div>
    </div>
  );
}

function Comparison({ inversion, target, line }: { inversion: InversionView; target: CompareTarget; line: LineDetail | undefined }) {
  const project = useProject(line?.projectId ?? '', { enabled: Boolean(line?.projectId) });
  const isInv = target.kind === 'inversion';
  const bInv = useInversion(isInv ? target.id : '');
  const bRun = useRun(isInv ? '' : target.id);
  const bOk = isInv ? bInv.data?.status === 'done' && bInv.data.lineId === inversion.lineId : bRun.data?.status === 'done' && bRun.data.lineId === inversion.lineId;
  const ready = inversion.status === 'done' && bOk;

  const sectionA = useInversionSection(inversion.id, ready);
  const sectionB = useInversionSection(isInv ? target.id : '', ready);
  const runModel = useRunModel(!isInv && ready ? bRun.data?.modelId : undefined);
  const runGrid = useModelGrid(!isInv && ready ? bRun.data?.modelId : undefined);
  const runShots = useRunShots(!isInv && ready ? bRun.data?.pickSetId : undefined, bRun.data?.pickSetRevision);
  const residualsA = useInversionResiduals(inversion.id, ready);
  const residualsB = useInversionResiduals(isInv ? target.id : '', ready && isInv);
  const runResiduals = useResiduals(isInv ? '' : target.id, ready && !isInv);

  const [threshold, setThreshold] = useState(DEFAULT_COVERAGE_THRESHOLD_M);
  const [ve, setVe] = useState(2);
  const [contours, setContours] = useState(true);

  const rangeA = useMemo(() => (sectionA.data ? sectionRange(sectionA.data) : null), [sectionA.data]);
  const rangeB = useMemo(() => (isInv ? (sectionB.data ? sectionRange(sectionB.data) : null) : modelRange(runGrid.data?.values ?? null)), [isInv, sectionB.data, runGrid.data]);
  const range = useMemo(() => sharedRange(rangeA, rangeB), [rangeA, rangeB]);
  // One colour scale over both sides: the project's, the two sections' joint range, or the viewer's.
  const colours = useLineSectionColours(inversion.lineId, range);
  const gridB = isInv ? sectionB.data?.grid : runGrid.data?.grid;
  const extent = useMemo(() => (sectionA.data && gridB ? unionExtent(sectionA.data.grid, gridB) : null), [sectionA.data, gridB]);
  const surface = (runModel.data?.model.surface as [number, number][] | undefined) ?? null;
  const runScene = useModelScene(isInv ? undefined : runGrid.data, surface, line?.stations ?? [], runShots.data, range ? colours.range : null, contours, range);

  const bLoading = isInv ? bInv.isPending : bRun.isPending;
  const bError = isInv ? bInv.error : bRun.error;
  const bTitle = isInv ? (bInv.data ? inversionTitle(bInv.data) : 'inversion') : bRun.data ? runTitle(bRun.data, line) : 'forward run';

  const header = (
    <PageHeader
      title={isInv ? 'Two inversions side by side' : 'Inversion beside a forward run'}
      crumbs={[
        { label: 'Projects', to: '/' },
        { label: project.data?.name ?? 'Project', to: line ? `/projects/${line.projectId}` : undefined },
        { label: line?.name ?? 'Line', to: `/lines/${inversion.lineId}?tab=inversions` },
        { label: 'Inversion A', to: `/lines/${inversion.lineId}/inversions/${inversion.id}` },
      ]}
    />
  );

  let body: ReactNode;
  if (bLoading) body = <Loading what={isInv ? 'inversion B' : 'forward run B'} />;
  else if (bError) body = <LoadError error={bError} what={isInv ? 'inversion to compare with' : 'forward run to compare with'} />;
  else if (isInv && target.id === inversion.id) body = <Refusal title="That is the same inversion twice.">Choose a different inversion or a forward run of this line.</Refusal>;
  else if ((isInv ? bInv.data?.lineId : bRun.data?.lineId) !== inversion.lineId) body = <Refusal title="These belong to different survey lines.">Only sections of the same line compare side by side.</Refusal>;
  else if (!ready) body = <Refusal title="Only finished inversions and runs can be compared.">Open them again once both have finished.</Refusal>;
  else {
    body = (
      <>
        <SectionControls
          threshold={threshold}
          ceiling={sectionA.data ? thresholdCeiling(sectionA.data.coverage) : 5}
          onThreshold={setThreshold}
          exaggeration={ve}
          onExaggeration={setVe}
          contours={contours}
          onContours={setContours}
        >
          <SectionColoursControl colours={colours} />
        </SectionControls>
        <p className="mb-3 text-sm text-stone-700" data-testid="compare-range">
          {range ? `Both sections use one colour scale, ${Math.round(colours.range.min)} to ${Math.round(colours.range.max)} m/s, so the same colour is the same velocity.` : 'Loading the sections…'}
          {!isInv && ' The forward run’s model was drawn by hand, so it has no coverage mask or depth of investigation.'}
        </p>
        {(sectionA.error || sectionB.error || runGrid.error) && <LoadError error={sectionA.error ?? sectionB.error ?? runGrid.error} what="section" />}
        <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
          {sectionA.data && range ? (
            <InversionSideView letter="A" extent={extent} inversion={inversion} section={sectionA.data} range={colours.range} contourRange={range} threshold={threshold} contours={contours} exaggeration={ve} />
          ) : (
            <Side letter="A" extent={extent} title={inversionTitle(inversion)} to={`/lines/${inversion.lineId}/inversions/${inversion.id}`} chi2={inversion.stats?.chi2} rmsMs={inversion.stats?.rms_ms} scene={null} exaggeration={ve} />
          )}
          {isInv ? (
            sectionB.data && range && bInv.data ? (
              <InversionSideView letter="B" extent={extent} inversion={bInv.data} section={sectionB.data} range={colours.range} contourRange={range} threshold={threshold} contours={contours} exaggeration={ve} />
            ) : (
              <Side letter="B" extent={extent} title={bTitle} to="#" chi2={null} rmsMs={null} scene={null} exaggeration={ve} />
            )
          ) : (
            <Side letter="B" extent={extent} title={bTitle} to={`/runs/${target.id}`} chi2={bRun.data?.stats?.chi2} rmsMs={bRun.data?.stats?.rms_ms} scene={runScene} exaggeration={ve} />
          )}
        </div>
        <div className="mb-8">
          <SectionLegend />
        </div>
        <Section title="Change in residual, B − A">
          <p className="mb-3 text-stone-600">Where the two sections predict different times for the same pick.</p>
          {(residualsA.isPending || (isInv ? residualsB.isPending : runResiduals.isPending)) && <Loading what="residuals" />}
          {residualsA.data && (isInv ? residualsB.data : runResiduals.data) && <DifferenceView a={residualsA.data} b={(isInv ? residualsB.data : runResiduals.data)!} />}
        </Section>
      </>
    );
  }
  return (
    <>
      <title>{`Inversion compared · ${line?.name ?? 'line'} · Timefield`}</title>
      {header}
      <TomographyCaution />
      {body}
    </>
  );
}

function InversionSideView(props: { letter: 'A' | 'B'; extent: Extent | null; inversion: InversionView; section: InversionSectionView; range: { min: number; max: number }; contourRange: { min: number; max: number }; threshold: number; contours: boolean; exaggeration: number }) {
  const { inversion, section, threshold, contours, range, contourRange } = props;
  const arrays = useSectionArrays(section);
  const scene = useSectionScene(section, arrays, threshold, contours, range, contourRange);
  return (
    <Side
      letter={props.letter}
      extent={props.extent}
      title={inversionTitle(inversion)}
      to={`/lines/${inversion.lineId}/inversions/${inversion.id}`}
      chi2={inversion.stats?.chi2}
      rmsMs={inversion.stats?.rms_ms}
      scene={scene}
      exaggeration={props.exaggeration}
      note={<> · {inversion.grid.dx} m cells</>}
    />
  );
}

/** An inversion section's own colour range: its covered ground. */
const sectionRange = (s: InversionSectionView) => coveredRange(toFloat32(s.velocity), toFloat32(s.coverage));

function runTitle(run: RunDetail, line: LineDetail | undefined): string {
  const summary = line ? lineRuns(line.runs).find((r) => r.id === run.id) : undefined;
  return summary ? `Forward run: ${runLabel(summary).split(' · ')[0]}` : 'Forward run';
}

export default InversionComparePage;
