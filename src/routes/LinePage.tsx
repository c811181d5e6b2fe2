import { useId, useState } from 'react';
import { useParams, useSearchParams } from 'react-router';
import { useLine } from '../api/lines';
import { useProject } from '../api/projects';
import type { ProjectRole } from '../api/types';
import { ChecksTab } from '../components/line/checks/ChecksTab';
import { ModelVersionsPanel } from '../components/line/models/ModelVersionsPanel';
import { LineRunsPanel } from '../components/run/line/LineRunsPanel';
import { LineInversionsPanel } from '../components/inversion/LineInversionsPanel';
import { InterpretationTab } from '../components/interpretation/InterpretationTab';
import { LineTabs, TabPanel, type TabDef } from '../components/line/LineTabs';
import { PickSetsTab } from '../components/line/picksets/PickSetsTab';
import { RecordsTab } from '../components/records/RecordsTab';
import { BoreholesTab } from '../components/boreholes/BoreholesTab';
import { StationsTab } from '../components/line/stations/StationsTab';
import { DepthToRockTab } from '../components/exports/DepthToRockTab';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { formatDate, ROLE_LABELS } from '../lib/format';

type TabKey = 'stations' | 'records' | 'boreholes' | 'picks' | 'checks' | 'layers' | 'models' | 'runs' | 'inversions' | 'rock';
const TAB_KEYS: TabKey[] = ['stations', 'records', 'boreholes', 'picks', 'checks', 'layers', 'models', 'runs', 'inversions', 'rock'];

/** Who may change field data on a line (the server's policy table decides; this only picks the view). */
const FIELD_EDITORS: ProjectRole[] = ['geophysicist', 'field_tech'];

/**
 * A survey line in tabs: its stations, its shot records, its boreholes, its pick sets, the quality checks of one pick set, the
 * layer methods on a pick set, its velocity model versions, its forward runs and its inversions. The tab, pick set and revision live in the address (?tab=…&pickset=…&rev=…),
 * so a link or a reload brings back the same view.
 */
export function LinePage() {
  const { lineId = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const idPrefix = useId().replace(/[^a-zA-Z0-9_-]/g, '');
  // Tabs stay mounted once opened, so unsaved station edits, kept fits and selections survive a look elsewhere.
  const [visited, setVisited] = useState<ReadonlySet<TabKey>>(new Set());
  const line = useLine(lineId);
  // The project name for the breadcrumb; the project page has usually cached it already.
  const project = useProject(line.data?.projectId ?? '', { enabled: Boolean(line.data?.projectId) });

  if (line.isPending) return <Loading what="survey line" />;
  if (line.isError) return <LoadError error={line.error} what="survey line" onRetry={() => void line.refetch()} />;

  const l = line.data;
  const requested = params.get('tab') as TabKey | null;
  const tab: TabKey = requested && TAB_KEYS.includes(requested) ? requested : l.pickSets.length > 0 ? 'checks' : 'stations';
  if (!visited.has(tab)) setVisited(new Set([...visited, tab]));
  const pickSetId = params.get('pickset');
  const revText = params.get('rev');
  const revision = revText !== null && /^\d+$/.test(revText) ? Number(revText) : null;
  const canEditField = l.myRole !== null && FIELD_EDITORS.includes(l.myRole);
  const canExclude = l.myRole === 'geophysicist';

  const checksSearch = (id: string, rev: number | null = null) => {
    const next = new URLSearchParams({ tab: 'checks', pickset: id });
    if (rev !== null) next.set('rev', String(rev));
    return next;
  };
  const selectTab = (key: TabKey) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        next.set('tab', key);
        return next;
      },
      { replace: true },
    );

  const tabs: TabDef<TabKey>[] = [
    { key: 'stations', label: 'Stations', badge: l.stations.length },
    { key: 'records', label: 'Records' },
    { key: 'boreholes', label: 'Boreholes' },
    { key: 'picks', label: 'Pick sets', badge: l.pickSets.length },
    { key: 'checks', label: 'Checks' },
    { key: 'layers', label: 'Layer methods' },
    { key: 'models', label: 'Models', badge: l.models.length },
    { key: 'runs', label: 'Runs', badge: l.runs.length },
    { key: 'inversions', label: 'Inversions' },
    { key: 'rock', label: 'Depth to rock' },
  ];

  return (
    <>
      <title>{`${l.name} · Timefield`}</title>
      <PageHeader
        title={l.name}
        crumbs={[
          { label: 'Projects', to: '/' },
          { label: project.data?.name ?? 'Project', to: `/projects/${l.projectId}` },
        ]}
      >
        <p className="text-sm text-stone-600">
          Created {formatDate(l.createdAt)}
          {l.myRole && <> · you are {ROLE_LABELS[l.myRole].toLowerCase()} on this project</>}
        </p>
        <div data-testid="line-notes" className="mt-3 max-w-prose whitespace-pre-line">
          {l.notes ? l.notes : <span className="text-stone-500">No notes for this line.</span>}
        </div>
      </PageHeader>

      <LineTabs tabs={tabs} selected={tab} onSelect={selectTab} idPrefix={idPrefix} />
      {visited.has('stations') && (
        <TabPanel idPrefix={idPrefix} tabKey="stations" hidden={tab !== 'stations'}>
          <StationsTab line={l} canEdit={canEditField} />
        </TabPanel>
      )}
      {visited.has('records') && (
        <TabPanel idPrefix={idPrefix} tabKey="records" hidden={tab !== 'records'}>
          <RecordsTab line={l} canEdit={canEditField} />
        </TabPanel>
      )}
      {visited.has('boreholes') && (
        <TabPanel idPrefix={idPrefix} tabKey="boreholes" hidden={tab !== 'boreholes'}>
          <BoreholesTab line={l} canEdit={canEditField} />
        </TabPanel>
      )}
      {visited.has('picks') && (
        <TabPanel idPrefix={idPrefix} tabKey="picks" hidden={tab !== 'picks'}>
          <PickSetsTab
            line={l}
            canUpload={canEditField}
            checksHref={(id) => `?${checksSearch(id).toString()}`}
            onUploaded={(created) => setParams(checksSearch(created.id))}
          />
        </TabPanel>
      )}
      {visited.has('checks') && (
        <TabPanel idPrefix={idPrefix} tabKey="checks" hidden={tab !== 'checks'}>
          <ChecksTab line={l} pickSetId={pickSetId} revision={revision} canExclude={canExclude} onChoose={(id, rev) => setParams(checksSearch(id, rev))} />
        </TabPanel>
      )}
      {visited.has('layers') && (
        <TabPanel idPrefix={idPrefix} tabKey="layers" hidden={tab !== 'layers'}>
          <InterpretationTab line={l} canSave={l.myRole === 'geophysicist'} />
        </TabPanel>
      )}
      {visited.has('models') && (
        <TabPanel idPrefix={idPrefix} tabKey="models" hidden={tab !== 'models'}>
          <ModelVersionsPanel line={l} />
        </TabPanel>
      )}
      {visited.has('runs') && (
        <TabPanel idPrefix={idPrefix} tabKey="runs" hidden={tab !== 'runs'}>
          <LineRunsPanel line={l} />
        </TabPanel>
      )}
      {visited.has('inversions') && (
        <TabPanel idPrefix={idPrefix} tabKey="inversions" hidden={tab !== 'inversions'}>
          <LineInversionsPanel line={l} />
        </TabPanel>
      )}
      {visited.has('rock') && (
        <TabPanel idPrefix={idPrefix} tabKey="rock" hidden={tab !== 'rock'}>
          <DepthToRockTab line={l} />
        </TabPanel>
      )}
    </>
  );
}
