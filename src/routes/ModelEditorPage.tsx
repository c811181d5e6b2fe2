import { useRef, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import type { ModelFile } from '../../shared/model';
import { defaultModel } from '../../shared/model/edit';
import { lineModelVersions, useLineOfModel, useModelVersion } from '../api/models';
import { usePickSet } from '../api/picksets';
import { useProject } from '../api/projects';
import { pickSetsInUse, type LineDetail, type ModelVersionDetail, type ModelVersionSummary } from '../api/types';
import { Loading, LoadError } from '../components/LoadState';
import { ModelEditor } from '../components/model/ModelEditor';
import { VersionList } from '../components/model/VersionList';
import { SectionExports } from '../components/exports/SectionExports';
import { PageHeader } from '../components/PageHeader';
import { Section } from '../components/Section';
import { formatDate } from '../lib/format';

interface Initial {
  key: string;
  model: ModelFile;
  base: ModelVersionSummary | null;
}

/**
 * Two addresses, one editor:
 * - /lines/:lineId/models/new[?from=<version id>] — a new draft, from the line's stations or
 *   started from a saved version (recorded as basedOn). Geophysicists only.
 * - /models/:modelId — one saved version, read-only for everyone who may read the line.
 * After a save the address moves to ?from=<new id> without reloading the editor, so undo history survives.
 */
export function ModelEditorPage() {
  const { lineId: lineParam, modelId } = useParams();
  const [params, setParams] = useSearchParams();
  const from = params.get('from');
  const versionId = modelId ?? from;
  const version = useModelVersion(versionId);
  const lineId = lineParam ?? version.data?.lineId ?? null;
  const line = useLineOfModel(lineId);
  const project = useProject(line.data?.projectId ?? '', { enabled: Boolean(line.data?.projectId) });
  const newestPickSet = line.data ? (pickSetsInUse(line.data.pickSets)[0]?.id ?? null) : null;
  const pickSet = usePickSet(!modelId && !from ? newestPickSet : null, null);

  // Which draft the editor holds; a save's own new id does not start a new draft.
  const adopted = useRef<string | null>(null);
  const [seenFrom, setSeenFrom] = useState(from);
  const [keyFrom, setKeyFrom] = useState(from);
  if (from !== seenFrom) {
    setSeenFrom(from);
    if (from !== adopted.current) setKeyFrom(from);
  }
  const editorKey = `${lineId}:${modelId ?? `new:${keyFrom ?? ''}`}`;
  const [initial, setInitial] = useState<Initial | null>(null);

  if (line.isError) return <LoadError error={line.error} what="survey line" onRetry={() => void line.refetch()} />;
  if (version.isError) return <LoadError error={version.error} what="model version" onRetry={() => void version.refetch()} />;

  const l = line.data;
  if (lineParam && !modelId && version.data && version.data.lineId !== lineParam) {
    return (
      <div role="alert" data-testid="load-error" className="rounded-lg border border-stone-300 bg-white px-5 py-6">
        <p className="text-lg font-semibold text-stone-900">That model version belongs to another survey line.</p>
        <p className="mt-1 text-stone-700">A new version can only start from a version of the same line.</p>
        <p className="mt-3">
          <Link to={`/models/${version.data.id}`}>Open that version</Link>
        </p>
      </div>
    );
  }
  const versions = l ? lineModelVersions(l.models) : [];
  const summaryOf = (id: string | null) => versions.find((v) => v.id === id) ?? null;

  if (initial?.key !== editorKey && l) {
    const ready = versionId ? version.data && version.data.id === versionId : !newestPickSet || pickSet.data || pickSet.isError;
    if (ready) {
      const model = versionId && version.data ? structuredClone(version.data.model) : defaultModel({ stations: l.stations, shotXs: pickSet.data?.shots.map((s) => s.sourceX) });
      setInitial({ key: editorKey, model, base: versionId ? summaryOf(versionId) : null });
    }
  }

  if (!l || initial?.key !== editorKey) return <Loading what={modelId ? 'model version' : 'model editor'} />;

  const canEdit = l.myRole === 'geophysicist';
  const readOnly = Boolean(modelId) || !canEdit;
  const crumbs = [
    { label: 'Projects', to: '/' },
    { label: project.data?.name ?? 'Project', to: `/projects/${l.projectId}` },
    { label: l.name, to: `/lines/${l.id}` },
  ];

  if (!modelId && !canEdit) {
    return (
      <>
        <title>{`Velocity models · ${l.name} · Timefield`}</title>
        <PageHeader title="Velocity models" crumbs={crumbs}>
          <p>Only geophysicists build and save velocity models. Open a saved version to look at it and preview its wavefronts.</p>
        </PageHeader>
        <Section title="Versions">
          <VersionList versions={versions} lineId={l.id} currentId={null} canEdit={false} />
        </Section>
      </>
    );
  }

  return (
    <>
      <title>{`${modelId && version.data ? `${version.data.name} v${version.data.version}` : 'Model editor'} · ${l.name} · Timefield`}</title>
      {modelId && version.data ? (
        <VersionHeader line={l} version={version.data} crumbs={crumbs} canEdit={canEdit} basedOn={summaryOf(version.data.basedOn)} />
      ) : (
        <PageHeader title="Velocity model editor" crumbs={crumbs}>
          <p data-testid="editor-subtitle">
            {initial.base
              ? `Started from “${initial.base.name}” version ${initial.base.version}. Saving makes a new version; version ${initial.base.version} stays as it is.`
              : `A new model for ${l.name}, laid out from its ${l.stations.length} stations.`}{' '}
            {versions.length > 0 && !initial.base && <Link to={`/lines/${l.id}/models/new?from=${versions[0].id}`}>Start from “{versions[0].name}” version {versions[0].version} instead</Link>}
          </p>
        </PageHeader>
      )}
      <ModelEditor
        key={editorKey}
        line={l}
        versions={versions}
        initial={initial.model}
        base={initial.base}
        readOnly={readOnly}
        onSaved={(id) => {
          adopted.current = id;
          setParams({ from: id }, { replace: true });
        }}
      />
      {modelId && <SectionExports base={`/api/models/${modelId}/export`} />}
    </>
  );
}

function VersionHeader({ line, version, crumbs, canEdit, basedOn }: { line: LineDetail; version: ModelVersionDetail; crumbs: { label: string; to: string }[]; canEdit: boolean; basedOn: ModelVersionSummary | null }) {
  return (
    <PageHeader title={`Model “${version.name}” version ${version.version}`} crumbs={crumbs}>
      <p data-testid="version-facts">
        Saved by {version.createdBy?.name ?? 'a removed account'} on {formatDate(version.createdAt)}
        {basedOn && ` · based on “${basedOn.name}” version ${basedOn.version}`} · read-only: saved versions never change.
      </p>
      {version.comment && <p className="mt-1 max-w-prose whitespace-pre-line text-stone-700">“{version.comment}”</p>}
      {canEdit && (
        <p className="mt-3">
          <Link to={`/lines/${line.id}/models/new?from=${version.id}`} className="font-semibold" data-testid="start-from">
            Start a new version from this one
          </Link>
        </p>
      )}
    </PageHeader>
  );
}
