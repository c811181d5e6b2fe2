/**
 * The velocity model editor: section view with tools, layer table, grid, checks, saving,
 * import/export and the live wavefront preview. The draft lives in an undo/redo history; the
 * preview is solved in a Web Worker from the rasterised draft.
 */
import { useBoreholes } from '../../api/boreholes';
import { BoreholeTiesTable } from '../boreholes/BoreholeTiesTable';
import { deepestInterfaceDepth, deepestLayerName } from '../../../shared/boreholes';
import { useDeferredValue, useMemo, useRef, useState } from 'react';
import type { Grid } from '../../../shared/grid';
import { evalPolyline, rasteriseModel, type ModelFile, type ModelLayer, type RasterModel } from '../../../shared/model';
import {
  addLayerBelow, checkDraft, deleteNode, gridIsUsable, insertNode, insertNodeInWidestGap, moveNode, paintCells, eraseCells, regridModel,
  removeLayer, updateLayer, type Point,
} from '../../../shared/model/edit';
import { isApiError, type ApiIssue } from '../../api/errors';
import { useSaveModel } from '../../api/models';
import { pickSetsInUse, type LineDetail, type ModelVersionSummary } from '../../api/types';
import { Section } from '../Section';
import { ChecksPanel } from './ChecksPanel';
import { GridForm } from './GridForm';
import { ImportExport } from './ImportExport';
import { LayerTable } from './LayerTable';
import { PreviewPanel } from './PreviewPanel';
import { SavePanel } from './SavePanel';
import { SectionView } from './SectionView';
import { velocityRange } from './colourScale';
import { SectionColoursControl } from '../plot/colours/SectionColoursControl';
import { useSectionColours } from '../plot/colours/useSectionColours';
import { defaultExaggeration } from './sectionGeometry';
import { Toolbar } from './Toolbar';
import type { Tool } from './tools';
import type { PreviewJob } from './usePreview';
import { WithPreview } from './WithPreview';
import { usePreviewShots } from './usePreviewShots';
import { useLeaveGuard } from './useLeaveGuard';
import { LeavePrompt } from '../LeavePrompt';
import { useModelDraft } from './useModelDraft';
import { VersionList } from './VersionList';

export interface ModelEditorProps {
  line: LineDetail;
  versions: ModelVersionSummary[];
  initial: ModelFile;
  /** The version shown (read-only) or started from (draft). */
  base: ModelVersionSummary | null;
  readOnly: boolean;
  /** Called with the new version's id after a save. */
  onSaved: (id: string) => void;
}

const withBase = (m: ModelFile, k: number, base: Point[]): ModelFile => ({ ...m, layers: m.layers!.map((l, i) => (i === k ? { ...l, base } : l)) });
const baseOf = (m: ModelFile, k: number): Point[] | undefined => m.layers?.[k]?.base as Point[] | undefined;
/** Dragged and nudged nodes land on whole millimetres: finer than any interpretation, and no float tails in the file. */
const mm = (v: number): number => Math.round(v * 1000) / 1000;

export function ModelEditor({ line, versions, initial, base, readOnly, onSaved }: ModelEditorProps) {
  const d = useModelDraft(initial, readOnly);
  const draft = d.draft;
  const [tool, setTool] = useState<Tool>('shape');
  const [paintV, setPaintV] = useState(300);
  const [brushRadius, setBrushRadius] = useState(() => Math.max(1, +(2 * initial.grid.dx).toFixed(3)));
  const [exaggeration, setExaggeration] = useState(() => (gridIsUsable(initial.grid) ? defaultExaggeration(initial.grid) : 2));
  const [selectedLayer, setSelectedLayer] = useState<number | null>(null);
  const [selectedNode, setSelectedNode] = useState<number | null>(null);
  const [rays, setRays] = useState(false);
  const [savedDraft, setSavedDraft] = useState<ModelFile>(initial);
  const [basedOn, setBasedOn] = useState<string | null>(base?.id ?? null);
  const save = useSaveModel(line.id);
  const holes = useBoreholes(line.id);

  const raster = useMemo(() => {
    if (!gridIsUsable(draft.grid)) return null;
    const t0 = performance.now();
    const r = rasteriseModel(draft);
    performance.measure('timefield:rasterise', { start: t0, end: performance.now() });
    return r;
  }, [draft]);
  // Ties to the logs: the top of the deepest layer (the base of the one above it), below the model's ground.
  const rockTop = useMemo(() => (raster ? deepestInterfaceDepth(draft, raster.surfaceZ) : null), [draft, raster]);
  const ownRange = useMemo(() => (raster ? velocityRange(raster.velocity, raster.active) : null), [raster]);
  const colours = useSectionColours(line.projectId, ownRange ? { min: ownRange.lo, max: ownRange.hi } : null);
  const deferred = useDeferredValue(draft);
  const check = useMemo(() => {
    const t0 = performance.now();
    const c = checkDraft(deferred, deferred === draft && raster ? raster : undefined);
    performance.measure('timefield:check', { start: t0, end: performance.now() });
    return c;
  }, [deferred, draft, raster]);
  const issueMap = useMemo(() => new Map(check.errors.map((e) => [e.path, e.message])), [check]);
  const dirty = draft !== savedDraft;

  const pickSets = pickSetsInUse(line.pickSets);
  const shots = usePreviewShots(pickSets, raster);
  // The redraw timing starts at the edit when the model changed, else (another shot, rays on) now.
  const jobRaster = useRef<RasterModel | null>(null);
  const job: PreviewJob | null = useMemo(() => {
    if (!raster || !shots.placed?.ok) return null;
    const editedAt = raster !== jobRaster.current ? d.editedAt.current : performance.now();
    jobRaster.current = raster;
    return { raster, shot: shots.placed.shot, rays, editedAt };
  }, [raster, shots.placed, rays, d.editedAt]);

  const { blocker, justSaved } = useLeaveGuard(dirty && !readOnly);

  const select = (layer: number | null, node: number | null) => {
    setSelectedLayer(layer);
    setSelectedNode(node);
  };

  // --- interface nodes
  function onNodeDrag(phase: 'start' | 'move' | 'end', k: number, i: number, x: number, z: number) {
    if (phase === 'start') return d.begin();
    d.transient((m) => {
      const b = baseOf(m, k);
      return b ? withBase(m, k, moveNode(b, i, mm(x), mm(z), m.grid)) : m;
    });
    if (phase === 'end') d.end();
  }
  function onNudge(dxCells: number, dzCells: number) {
    if (selectedLayer === null || selectedNode === null) return;
    const k = selectedLayer;
    const i = selectedNode;
    d.commit((m) => {
      const b = baseOf(m, k);
      if (!b || !b[i]) return m;
      return withBase(m, k, moveNode(b, i, mm(b[i][0] + dxCells * m.grid.dx), mm(b[i][1] + dzCells * m.grid.dz), m.grid));
    });
  }
  function onDeleteNode(k = selectedLayer, i = selectedNode) {
    if (k === null || i === null) return;
    d.commit((m) => {
      const b = baseOf(m, k);
      return b ? withBase(m, k, deleteNode(b, i)) : m;
    });
    setSelectedNode(i > 0 ? i - 1 : null);
  }
  function onInsertNode(k: number, x: number) {
    const b = baseOf(draft, k);
    if (!b) return;
    const at = mm(x);
    const next = insertNode(b, at);
    if (next === b) return;
    d.commit((m) => withBase(m, k, insertNode(baseOf(m, k)!, at, mm(evalPolyline(baseOf(m, k)!, at)))));
    select(k, next.findIndex((p) => p[0] === at));
  }

  // --- paint
  const paintInvalid = !(paintV > 0) || !Number.isFinite(paintV) ? 'The paint velocity must be a number > 0 m/s.' : undefined;
  function applyCells(m: ModelFile, cells: number[], erase: boolean): ModelFile {
    const edits = erase ? eraseCells(m.edits ?? [], m.grid, cells) : paintCells(m.edits ?? [], m.grid, cells, paintV, raster?.active);
    return edits === m.edits ? m : { ...m, edits };
  }
  function onStroke(phase: 'start' | 'move' | 'end', cells: number[]) {
    if (phase === 'start') d.begin();
    if (phase === 'end') return d.end();
    if (tool === 'brush' && paintInvalid) return;
    d.transient((m) => applyCells(m, cells, tool === 'erase'));
  }
  function onRectangle(cells: number[]) {
    if (paintInvalid) return;
    d.commit((m) => applyCells(m, cells, false));
  }

  // --- layers and grid
  const changeLayers = (f: (layers: ModelLayer[], m: ModelFile) => ModelLayer[]) => d.commit((m) => (m.layers ? { ...m, layers: f(m.layers, m) } : m));
  function applyGrid(g: Grid): string | null {
    const r = regridModel(draft, g);
    if (!r.ok) return r.message;
    d.commit(() => r.model);
    select(null, null);
    return `Grid applied: ${g.nx} × ${g.nz} nodes.${r.editsBefore ? ` ${r.editsBefore} painted cells became ${r.editsAfter} at the new spacing.` : ''}`;
  }

  const serverError = save.error;
  const serverIssues: ApiIssue[] = isApiError(serverError) ? serverError.issues : [];
  const versionLabel = (id: string | null) => {
    const v = versions.find((x) => x.id === id);
    return v ? `“${v.name}” version ${v.version}` : null;
  };
  const blocked = readOnly ? 'This version is read-only.' : check.errors.length ? 'Fix the problems listed under Checks first.' : deferred !== draft ? 'Checking…' : null;
  const exportName = `${line.name}-${base && readOnly ? `${base.name}-v${base.version}` : 'draft'}`;

  return (
    <div data-testid="model-editor" data-dirty={dirty}>
      <LeavePrompt blocker={blocker} what="Leave the editor without saving? The changes since the last save will be lost." />
      <Toolbar
        tool={tool}
        onTool={setTool}
        paintV={paintV}
        onPaintV={setPaintV}
        paintInvalid={paintInvalid}
        brushRadius={brushRadius}
        onBrushRadius={setBrushRadius}
        canUndo={d.canUndo}
        canRedo={d.canRedo}
        onUndo={d.undo}
        onRedo={d.redo}
        exaggeration={exaggeration}
        onExaggeration={setExaggeration}
        readOnly={readOnly}
        colours={<SectionColoursControl colours={colours} />}
      />
      <WithPreview job={job}>
        {(preview) => {
          const misfit = shots.misfit(preview);
          return (
            <>
              {raster ? (
                <SectionView
                  model={draft}
                  raster={raster}
                  exaggeration={exaggeration}
                  tool={tool}
                  brushRadius={brushRadius}
                  readOnly={readOnly}
                  selectedLayer={selectedLayer}
                  selectedNode={selectedNode}
                  onSelect={select}
                  onNodeDrag={onNodeDrag}
                  onInsertNode={onInsertNode}
                  onStroke={onStroke}
                  onRectangle={onRectangle}
                  onNudge={onNudge}
                  onDeleteNode={() => onDeleteNode()}
                  stations={line.stations}
                  boreholes={holes.data}
                  shots={shots.shots}
                  selectedShot={shots.shotId}
                  onSelectShot={shots.setShotId}
                  preview={preview}
                  previewShot={shots.placed?.ok ? shots.placed.shot : null}
                  colourRange={colours.range}
                />
              ) : (
                <p role="alert" className="rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-900">
                  The grid cannot be drawn: {check.errors.find((e) => e.path === 'grid')?.message ?? 'its numbers are not usable'}.
                </p>
              )}
              <p className="mt-1 text-sm text-stone-600" data-testid="edit-count">
                {(draft.edits ?? []).length} painted cells · {draft.layers ? `${draft.layers.length} layers` : 'raw velocity grid'}
                {dirty && !readOnly && <span className="ml-2 rounded-full bg-amber-100 px-2 text-amber-900">unsaved changes</span>}
              </p>
              {raster && rockTop && <BoreholeTiesTable holes={holes.data ?? []} depthAt={rockTop} surfaceName={deepestLayerName(draft)} />}

              <PreviewPanel
                pickSets={pickSets}
                pickSetId={shots.pickSetId}
                onPickSet={shots.setPickSetId}
                shots={shots.shots}
                shotId={shots.shotId}
                onShot={shots.setShotId}
                rays={rays}
                onRays={setRays}
                state={preview}
                placementProblem={shots.placed && !shots.placed.ok ? shots.placed.message : null}
                rmsMs={misfit?.rmsMs ?? null}
                picks={misfit?.count ?? 0}
                loadingPicks={shots.loading}
              />
            </>
          );
        }}
      </WithPreview>

      <div className="mt-8 grid grid-cols-1 gap-8 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div>
          <Section title="Layers" description="Top-down; each layer's base is the next layer's top.">
            {draft.layers ? (
              <LayerTable
                layers={draft.layers}
                readOnly={readOnly}
                selectedLayer={selectedLayer}
                selectedNode={selectedNode}
                issues={issueMap}
                onSelect={select}
                onChangeLayer={(k, patch) => changeLayers((ls) => updateLayer(ls, k, patch))}
                onAddBelow={(k) => {
                  changeLayers((ls, m) => addLayerBelow(ls, k, m.grid, m.surface as Point[] | undefined));
                  select(k + 1, null);
                }}
                onRemove={(k) => {
                  changeLayers((ls) => removeLayer(ls, k));
                  select(null, null);
                }}
                onMoveNode={(k, i, x, z) =>
                  d.commit((m) => {
                    const b = baseOf(m, k);
                    return b ? withBase(m, k, b.map((p, j) => (j === i ? ([x, z] as Point) : p))) : m;
                  })
                }
                onAddNode={(k) => d.commit((m) => withBase(m, k, insertNodeInWidestGap(baseOf(m, k) ?? [])))}
                onDeleteNode={(k, i) => onDeleteNode(k, i)}
              />
            ) : (
              <p className="text-stone-700">This model is a raw velocity grid, so it has no layers. Paint over it, or start from a layered version.</p>
            )}
          </Section>
        </div>
        <div>
          <Section title="Checks">
            <ChecksPanel check={check} draft={draft} serverIssues={serverIssues} serverMessage={serverError ? (serverError as Error).message : null} />
          </Section>
          {!readOnly && (
            <Section title="Save">
              <SavePanel
                defaultName={base?.name ?? 'main'}
                basedOnLabel={versionLabel(basedOn)}
                blocked={blocked}
                busy={save.isPending}
                dirty={dirty}
                saved={save.data ? { name: save.data.name, version: save.data.version, warnings: save.data.warnings } : null}
                onSave={(name, comment) => {
                  const snapshot = draft;
                  save.mutate(
                    { model: snapshot, name, comment, basedOn },
                    {
                      onSuccess: (res) => {
                        justSaved.current = res.id;
                        setSavedDraft(snapshot);
                        setBasedOn(res.id);
                        onSaved(res.id);
                      },
                    },
                  );
                }}
              />
            </Section>
          )}
          <Section title="Grid">
            <GridForm grid={draft.grid} readOnly={readOnly} lockedReason={draft.velocity ? 'A raw velocity grid keeps its own grid.' : undefined} onApply={applyGrid} />
          </Section>
          <Section title="Files">
            <ImportExport
              model={draft}
              raster={raster}
              baseName={exportName}
              readOnly={readOnly}
              exportBlocked={check.errors.length ? 'Fix the problems listed under Checks before exporting.' : null}
              onImport={(m) => {
                d.commit(() => m);
                select(null, null);
              }}
            />
          </Section>
        </div>
      </div>

      <Section title="Versions" description="Saved versions never change; saving always makes a new one.">
        <VersionList versions={versions} lineId={line.id} currentId={readOnly ? (base?.id ?? null) : null} canEdit={line.myRole === 'geophysicist'} />
      </Section>
    </div>
  );
}
