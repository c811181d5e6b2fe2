import { useCallback, useDeferredValue, useMemo, useState, type ReactNode } from 'react';
import { findFarPositions, findReciprocalPairs, flagSuspectPicks, positionsOfPicks, travelTimeCurves, type QcPick } from '../../../../shared/qc';
import type { PickSetDetail } from '../../../api/types';
import { Section } from '../../Section';
import { ApparentVelocityPanel, type FitRequest } from './ApparentVelocityPanel';
import { ExclusionForm } from './ExclusionForm';
import { FarPositionsWarning } from './FarPositionsWarning';
import type { KeptFit } from './fits';
import { PicksTable } from './PicksTable';
import { toQcPicks } from './qcPicks';
import { ReciprocalTable } from './ReciprocalTable';
import { ShotsTable } from './ShotsTable';
import { SuspectPicksTable } from './SuspectPicksTable';
import { OVERLAY } from './chartTraces';
import { TravelTimeChart } from './TravelTimeChart';
import { useExclusionDraft } from './useExclusionDraft';

function Fact({ term, children, tone }: { term: string; children: ReactNode; tone?: 'warn' }) {
  return (
    <div>
      <dt className="text-sm text-stone-600">{term}</dt>
      <dd className={`text-xl font-semibold tabular-nums ${tone === 'warn' ? 'text-amber-800' : 'text-stone-900'}`}>{children}</dd>
    </div>
  );
}

/** A tolerance as typed, in ms: a finite number ≥ 0, or a message. */
function readTolerance(text: string): { ms: number | null; error?: string } {
  const t = text.trim();
  const v = Number(t);
  if (t === '' || !Number.isFinite(v) || v < 0) return { ms: null, error: 'Enter a number of milliseconds, 0 or more.' };
  return { ms: v };
}

/**
 * Every check on one revision of one pick set. Unsaved exclusions take effect at once on the
 * chart and tables, so a geophysicist sees what a new revision would change before saving it.
 */
export function PickSetChecks({
  data,
  stationXs,
  canExclude,
  onRevisionSaved,
}: {
  data: PickSetDetail;
  /** x of every station of the line, for the far-position warning. */
  stationXs: readonly number[];
  canExclude: boolean;
  onRevisionSaved: (revision: number) => void;
}) {
  const ex = useExclusionDraft(data, onRevisionSaved);
  // Hundreds of agreeing pairs would bury the curves in diamonds: start with those hidden.
  const [hidden, setHidden] = useState<Set<string>>(() => new Set(data.qc.reciprocalPairs.length > 40 ? [OVERLAY.pairOk] : []));
  const [tolerance, setTolerance] = useState(String(data.qc.reciprocalToleranceMs));
  const [dragMode, setDragMode] = useState<'zoom' | 'select'>('zoom');
  const [fitRequest, setFitRequest] = useState<FitRequest>({ shotId: data.shots[0]?.shotId ?? '', xFrom: '', xTo: '' });
  const [fits, setFits] = useState<KeptFit[]>([]);

  const qcPicks = useMemo(() => toQcPicks(data.picks, ex.excluded), [data.picks, ex.excluded]);
  const picksByIndex = useMemo(() => new Map(data.picks.map((p) => [p.index, p])), [data.picks]);
  const curves = useMemo(() => travelTimeCurves(qcPicks), [qcPicks]);
  const flags = useMemo(() => flagSuspectPicks(qcPicks), [qcPicks]);
  const far = useMemo(() => findFarPositions(positionsOfPicks(qcPicks), stationXs), [qcPicks, stationXs]);
  const tol = readTolerance(tolerance);
  // Typing stays responsive on a large pick set; the chart catches up with the deferred value.
  const toleranceMs = useDeferredValue(tol.ms ?? data.qc.reciprocalToleranceMs);
  const pairs = useMemo(() => findReciprocalPairs(qcPicks, { toleranceS: toleranceMs / 1000 }), [qcPicks, toleranceMs]);
  const byShot = useMemo(() => {
    const m = new Map<string, QcPick[]>();
    for (const p of qcPicks) {
      const list = m.get(p.shotId);
      if (list) list.push(p);
      else m.set(p.shotId, [p]);
    }
    return m;
  }, [qcPicks]);
  const shotOrder = useMemo(() => new Map(curves.map((c, k) => [c.shotId, k])), [curves]);
  const overTolerance = pairs.filter((p) => p.flagged).length;
  const latest = data.revisions.at(-1)?.number ?? data.revision.number;

  // Stable callbacks, so the memoised chart is not redrawn when unrelated state changes.
  const toggleTrace = useCallback((name: string) => {
    setHidden((h) => {
      const next = new Set(h);
      if (!next.delete(name)) next.add(name);
      return next;
    });
  }, []);
  const { flipSelected } = ex;
  const onPickClick = useCallback(
    (index: number) => {
      const p = picksByIndex.get(index);
      if (p) setFitRequest((r) => ({ ...r, shotId: p.shotId }));
      if (canExclude) flipSelected(index);
    },
    [picksByIndex, canExclude, flipSelected],
  );
  const onRange = useCallback((a: number, b: number) => {
    setFitRequest((r) => ({ ...r, xFrom: String(+a.toFixed(2)), xTo: String(+b.toFixed(2)) }));
  }, []);

  const pickSetLabel = `${data.fileName}, revision ${data.revision.number}`;

  return (
    <div data-testid="pickset-checks" data-revision={data.revision.number}>
      <dl data-testid="checks-facts" className="mb-8 flex flex-wrap gap-x-10 gap-y-3">
        <Fact term="Shots">{data.shots.length}</Fact>
        <Fact term="Picks">{data.picks.length.toLocaleString('en-GB')}</Fact>
        <Fact term="Excluded">{ex.draft.size}</Fact>
        <Fact term="Suspect picks" tone={flags.length ? 'warn' : undefined}>
          {flags.length}
        </Fact>
        <Fact term="Far from stations" tone={far.positions.length ? 'warn' : undefined}>
          {far.medianSpacing === null ? '–' : far.positions.length}
        </Fact>
        <Fact term={`Reciprocal pairs over ${toleranceMs} ms`} tone={overTolerance ? 'warn' : undefined}>
          {overTolerance} of {pairs.length}
        </Fact>
      </dl>

      <FarPositionsWarning result={far} />

      <Section
        title="Travel-time curves"
        description={`Time against receiver x for every shot of ${pickSetLabel}. Click a legend entry or a shot’s checkbox to hide or show it.`}
        actions={
          <div role="group" aria-label="Dragging on the chart" className="flex rounded-md border border-stone-300 bg-white p-0.5 text-sm">
            {(['zoom', 'select'] as const).map((m) => (
              <button
                key={m}
                type="button"
                aria-pressed={dragMode === m}
                onClick={() => setDragMode(m)}
                data-testid={`drag-${m}`}
                className={`rounded px-3 py-1 font-semibold ${dragMode === m ? 'bg-accent-700 text-white' : 'text-stone-700 hover:bg-stone-100'}`}
              >
                {m === 'zoom' ? 'Drag to zoom' : 'Drag to choose a fit range'}
              </button>
            ))}
          </div>
        }
      >
        <div data-testid="traveltime-chart" className="rounded-lg border border-stone-200 bg-white p-2">
          <TravelTimeChart
            revisionKey={`${data.id}`}
            curves={curves}
            picksByIndex={picksByIndex}
            excluded={ex.excluded}
            hidden={hidden}
            flags={flags}
            pairs={pairs}
            fits={fits}
            selected={ex.selected}
            dragMode={dragMode}
            onToggleTrace={toggleTrace}
            onRange={onRange}
            onPickClick={onPickClick}
          />
        </div>
        <p className="mt-2 text-sm text-stone-600">
          Stars on the foot of the chart mark the shot positions; red rings mark suspect picks; diamonds mark reciprocal pairs (large amber ones differ by more than the tolerance); crosses are excluded picks.
          {canExclude ? ' Click a pick to select it for exclusion.' : ''}
        </p>
      </Section>

      <div className="grid grid-cols-1 gap-x-8 xl:grid-cols-2">
        <Section title="Apparent velocities" description="Choose a shot and an x range on one side of its source; the fitted line is drawn and labelled on the chart.">
          <ApparentVelocityPanel shots={data.shots} picksOfShot={(id) => byShot.get(id) ?? []} request={fitRequest} onRequest={setFitRequest} fits={fits} onFits={setFits} />
        </Section>
        <Section title="Reciprocal times" description="Time from A to a receiver at B’s source against time from B to a receiver at A’s source.">
          <ReciprocalTable pairs={pairs} tolerance={tolerance} toleranceError={tol.error} onTolerance={setTolerance} />
        </Section>
      </div>

      <Section title="Suspect picks" description="Steps between neighbouring receivers faster than 8000 m/s or slower than 100 m/s by more than the picks’ own uncertainty explains, and times that fall away from the source. Look at these traces again; a flag is not a verdict.">
        <SuspectPicksTable flags={flags} picksByIndex={picksByIndex} selected={ex.selected} onSelect={canExclude ? flipSelected : undefined} />
      </Section>

      <Section title="Shots" description="Derived from the pick file: one source position per shot id.">
        <ShotsTable shots={data.shots} order={shotOrder} hidden={hidden} onToggle={toggleTrace} />
      </Section>

      <Section
        title={canExclude ? 'Picks and exclusions' : 'Picks'}
        description={canExclude ? 'Select picks, give a reason and exclude them; saving makes a new revision and leaves the upload and earlier revisions untouched.' : 'Only a geophysicist can exclude picks.'}
      >
        {canExclude && (
          <div className="mb-4">
            <ExclusionForm
              key={data.revision.number}
              selectedCount={ex.selected.size}
              selectedExcluded={[...ex.selected].filter((i) => ex.draft.has(i)).length}
              added={ex.added}
              removed={ex.removed}
              nextRevision={latest + 1}
              saving={ex.revise.isPending}
              error={ex.revise.error}
              onExclude={ex.excludeSelected}
              onInclude={ex.includeSelected}
              onClearSelection={ex.clearSelection}
              onDiscard={ex.discard}
              onSave={ex.save}
            />
          </div>
        )}
        <PicksTable picks={data.picks} shots={data.shots} flags={flags} exclusions={ex.draft} saved={ex.saved} selected={ex.selected} onToggle={canExclude ? ex.toggleSelected : undefined} />
      </Section>
    </div>
  );
}
