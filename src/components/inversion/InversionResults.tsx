import { useId, useMemo } from 'react';
import { useSearchParams } from 'react-router';
import { useInversionResiduals, useInversionSection } from '../../api/inversions';
import type { ResidualRow } from '../../api/types';
import type { InversionView } from '../../../shared/schemas/inversions';
import { Loading, LoadError } from '../LoadState';
import { MisfitView } from '../run/misfit/MisfitView';
import { RunTabPanel, RunTabs, type RunTab } from '../run/RunTabs';
import { ResidualTable } from '../run/table/ResidualTable';
import { CheckerboardPanel } from './CheckerboardPanel';
import { InversionSectionPanel } from './InversionSectionPanel';
import { SectionExports } from '../exports/SectionExports';
import { useEnsembleBandColumn } from '../ensemble/useEnsembleBandColumn';

type View = 'section' | 'checkerboard' | 'misfit' | 'table' | 'exports';

/**
 * A finished inversion's views: the final section, the checkerboard test when it was run, and the
 * residuals as the run pages show them (misfit map, table). The view and chosen pick live in the address.
 */
export function InversionResults({ inversion, lineName }: { inversion: InversionView; lineName: string }) {
  const [params, setParams] = useSearchParams();
  const idPrefix = useId().replace(/[^a-zA-Z0-9_-]/g, '');
  const section = useInversionSection(inversion.id);
  const residuals = useInversionResiduals(inversion.id);
  const band = useEnsembleBandColumn(inversion.id);
  const tabs: RunTab<View>[] = [
    { key: 'section', label: 'Velocity section' },
    ...(inversion.settings.checkerboard ? [{ key: 'checkerboard' as const, label: 'Checkerboard test' }] : []),
    { key: 'misfit', label: 'Misfit map' },
    { key: 'table', label: 'Residual table' },
    { key: 'exports', label: 'Depth to rock & exports' },
  ];
  const requested = params.get('view') as View | null;
  const view: View = requested && tabs.some((t) => t.key === requested) ? requested : 'section';
  const pickText = params.get('pick');
  const pick = pickText !== null && /^\d+$/.test(pickText) ? Number(pickText) : null;
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
  const selectPick = (row: ResidualRow) => update({ pick: String(row.pickIndex) });
  const needsSection = view === 'section' || view === 'checkerboard';

  return (
    <>
      <RunTabs tabs={tabs} selected={view} onSelect={(v) => update({ view: v })} idPrefix={idPrefix} />
      <RunTabPanel idPrefix={idPrefix} tabKey={view}>
        {needsSection && section.isPending && <Loading what="section" />}
        {needsSection && section.isError && <LoadError error={section.error} what="section" onRetry={() => void section.refetch()} />}
        {view === 'exports' && <SectionExports base={`/api/inversions/${inversion.id}/export`} band={band ?? undefined} />}
        {view === 'section' && section.data && <InversionSectionPanel section={section.data} lineId={inversion.lineId} />}
        {view === 'checkerboard' && section.data && (
          section.data.checkerboard ? (
            <CheckerboardPanel section={section.data} checkerboard={section.data.checkerboard} />
          ) : (
            <p className="text-stone-700">The checkerboard test was asked for but no result was stored with this inversion.</p>
          )
        )}
        {!needsSection && view !== 'exports' && residuals.isPending && <Loading what="residuals" />}
        {!needsSection && view !== 'exports' && residuals.isError && <LoadError error={residuals.error} what="residuals" onRetry={() => void residuals.refetch()} />}
        {residuals.data && view === 'misfit' && (
          <MisfitView rows={residuals.data} selected={selectedRow} onSelect={selectPick} onShowInTable={(r) => update({ view: 'table', filter: r.shotId, pick: String(r.pickIndex) })} />
        )}
        {residuals.data && view === 'table' && (
          <ResidualTable
            key={params.get('filter') ?? ''}
            rows={residuals.data}
            lineName={lineName}
            runId={inversion.id}
            initialShot={params.get('filter')}
            selectedPick={pick}
            onSelect={(r) => update({ view: 'misfit', pick: String(r.pickIndex) })}
          />
        )}
      </RunTabPanel>
    </>
  );
}
