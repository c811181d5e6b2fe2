import { useEffect, useId, useMemo } from 'react';
import { useSearchParams } from 'react-router';
import { lineRuns, useResiduals } from '../../api/runs';
import type { LineDetail, ResidualRow, RunDetail, RunStats } from '../../api/types';
import { Loading, LoadError } from '../LoadState';
import { CompareChooser } from './compare/CompareChooser';
import { TravelTimeCurves } from './curves/TravelTimeCurves';
import { MisfitView } from './misfit/MisfitView';
import { preloadRunCharts } from './plot/RunPlot';
import { RunTabPanel, RunTabs, type RunTab } from './RunTabs';
import { SectionView } from './section/SectionView';
import { SectionExports } from '../exports/SectionExports';
import { RunSummary } from './summary/RunSummary';
import { ResidualTable } from './table/ResidualTable';
import { compareShotIds } from './table/residualFilters';

type View = 'section' | 'curves' | 'misfit' | 'table' | 'exports';
const TABS: RunTab<View>[] = [
  { key: 'section', label: 'Section' },
  { key: 'curves', label: 'Travel-time curves' },
  { key: 'misfit', label: 'Misfit map' },
  { key: 'table', label: 'Residual table' },
  { key: 'exports', label: 'Depth to rock & exports' },
];

/**
 * A finished run: the summary and verdict, then four views of the same residuals. The view, shot and
 * chosen pick live in the address (?view=…&shot=…&pick=…; &filter=… preselects the table's shot), so a link or a reload shows the same thing.
 */
export function RunResults({ run, stats, line }: { run: RunDetail; stats: RunStats; line: LineDetail | undefined }) {
  const [params, setParams] = useSearchParams();
  const idPrefix = useId().replace(/[^a-zA-Z0-9_-]/g, '');
  const residuals = useResiduals(run.id);
  const shotIds = useMemo(() => stats.by_shot.map((s) => s.shotId).sort(compareShotIds), [stats]);

  const requested = params.get('view') as View | null;
  const view: View = requested && TABS.some((t) => t.key === requested) ? requested : 'section';
  const shotParam = params.get('shot');
  const shotId = shotParam && shotIds.includes(shotParam) ? shotParam : (shotIds[0] ?? '');
  const pickText = params.get('pick');
  const pick = pickText !== null && /^\d+$/.test(pickText) ? Number(pickText) : null;
  // The section needs no chart library; load it quietly for the curves tab once the page has settled.
  useEffect(() => {
    const timer = setTimeout(preloadRunCharts, 1500);
    return () => clearTimeout(timer);
  }, []);
  const selectedRow = useMemo(() => residuals.data?.find((r) => r.pickIndex === pick) ?? null, [residuals.data, pick]);

  const update = (changes: Record<string, string | null>) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        for (const [k, v] of Object.entries(changes)) {
          if (v === null) next.delete(k);
          else next.set(k, v);
        }
        return next;
      },
      { replace: true },
    );
  const selectPick = (row: ResidualRow) => update({ pick: String(row.pickIndex), shot: row.shotId });

  return (
    <>
      <RunSummary stats={stats} onShowShot={(s) => update({ view: 'section', shot: s, pick: null })} />
      {line && (
        <div className="mb-10">
          <CompareChooser runId={run.id} runs={lineRuns(line.runs)} />
        </div>
      )}
      <h2 className="mb-3 text-xl font-semibold text-stone-900">Views</h2>
      <RunTabs tabs={TABS} selected={view} onSelect={(v) => update({ view: v })} idPrefix={idPrefix} />
      <RunTabPanel idPrefix={idPrefix} tabKey={view}>
        {view === 'section' && (
          <SectionView
            run={run}
            stations={line?.stations ?? []}
            shotIds={shotIds}
            shotId={shotId}
            highlightPick={selectedRow && selectedRow.shotId === shotId ? selectedRow.pickIndex : null}
            onShot={(s) => update({ shot: s })}
          />
        )}
        {view === 'exports' && <SectionExports base={`/api/runs/${run.id}/export`} />}
        {view !== 'section' && view !== 'exports' && residuals.isPending && <Loading what="residuals" />}
        {view !== 'section' && view !== 'exports' && residuals.isError && <LoadError error={residuals.error} what="residuals" onRetry={() => void residuals.refetch()} />}
        {residuals.data && view === 'curves' && <TravelTimeCurves runId={run.id} rows={residuals.data} onPick={(i) => update({ view: 'misfit', pick: String(i) })} />}
        {residuals.data && view === 'misfit' && (
          <MisfitView
            rows={residuals.data}
            selected={selectedRow}
            onSelect={selectPick}
            onShowRay={(r) => update({ view: 'section', shot: r.shotId, pick: String(r.pickIndex) })}
            onShowInTable={(r) => update({ view: 'table', filter: r.shotId, pick: String(r.pickIndex) })}
          />
        )}
        {residuals.data && view === 'table' && (
          <ResidualTable
            key={params.get('filter') ?? ''}
            rows={residuals.data}
            lineName={line?.name ?? 'line'}
            runId={run.id}
            initialShot={params.get('filter')}
            selectedPick={pick}
            onSelect={(r) => update({ view: 'misfit', pick: String(r.pickIndex), shot: r.shotId })}
          />
        )}
      </RunTabPanel>
    </>
  );
}
