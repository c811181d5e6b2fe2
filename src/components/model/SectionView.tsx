/**
 * The model section on a canvas: heatmap, interfaces, paint, stations, shots and the preview's
 * wavefronts, with the pointer gestures of each tool and keyboard nudging of the selected node.
 * Gestures report model coordinates; the editor turns them into history steps.
 */
import type { SectionHole } from '../plot/drawBoreholes';
import { useEffect, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { sampleTime } from '../../../shared/eikonal';
import type { ModelFile, RasterModel } from '../../../shared/model';
import { brushCells, brushStrokeCells, nearestNode, rectangleCells } from '../../../shared/model/edit';
import type { PlacedShot } from '../../../shared/picks';
import { ColourBar } from './ColourBar';
import { drawSection, heatmapImage, type SceneInterface, type SectionScene } from './drawSection';
import { paintedOutline } from './paintedOutline';
import { distanceToSegment, insidePlot, layoutSection, pxToX, pxToZ, xToPx, zToPx } from './sectionGeometry';
import type { Tool } from './tools';
import type { PreviewState } from './usePreview';

type Pt = [number, number];

export interface SectionViewProps {
  model: ModelFile;
  raster: RasterModel;
  exaggeration: number;
  tool: Tool;
  brushRadius: number;
  readOnly: boolean;
  selectedLayer: number | null;
  selectedNode: number | null;
  onSelect: (layer: number | null, node: number | null) => void;
  onNodeDrag: (phase: 'start' | 'move' | 'end', layer: number, node: number, x: number, z: number) => void;
  onInsertNode: (layer: number, x: number) => void;
  onStroke: (phase: 'start' | 'move' | 'end', cells: number[]) => void;
  onRectangle: (cells: number[]) => void;
  onNudge: (dxCells: number, dzCells: number) => void;
  onDeleteNode: () => void;
  stations: readonly { x: number; z: number }[];
  /** The line's boreholes and trial pits. */
  boreholes?: readonly SectionHole[];
  shots: readonly { id: string; x: number; z: number }[];
  selectedShot: string | null;
  onSelectShot: (id: string) => void;
  preview: PreviewState;
  previewShot: PlacedShot | null;
  /** The velocity colour range (m/s): the project's unless the viewer chose another. */
  colourRange: { min: number; max: number };
}

type Gesture =
  | { kind: 'drag'; layer: number; node: number }
  | { kind: 'stroke'; last: { x: number; z: number } }
  | { kind: 'rect'; a: Pt; b: Pt };

interface Hover {
  px: number;
  py: number;
  x: number;
  z: number;
}

const HANDLE_HIT_PX = 9;
const LINE_HIT_PX = 6;

export function SectionView(props: SectionViewProps) {
  const { model, raster, exaggeration, tool, readOnly, preview } = props;
  const boxRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const [width, setWidth] = useState(900);
  const [hover, setHover] = useState<Hover | null>(null);
  const [gesture, setGesture] = useState<Gesture | null>(null);
  const measured = useRef<number | null>(null);

  useEffect(() => {
    const box = boxRef.current;
    if (!box) return;
    const ro = new ResizeObserver(([entry]) => setWidth(Math.max(320, Math.floor(entry.contentRect.width))));
    ro.observe(box);
    return () => ro.disconnect();
  }, []);

  const layout = useMemo(() => layoutSection(raster.grid, width, exaggeration), [raster.grid, width, exaggeration]);
  const { min: colourMin, max: colourMax } = props.colourRange;
  const range = useMemo(() => ({ lo: colourMin, hi: colourMax }), [colourMin, colourMax]);
  const heatmap = useMemo(() => {
    const t0 = performance.now();
    const image = heatmapImage(raster, range);
    performance.measure('timefield:heatmap', { start: t0, end: performance.now() });
    return image;
  }, [raster, range]);
  const painted = useMemo(() => paintedOutline(raster.grid, model.edits ?? []), [raster.grid, model.edits]);
  const interfaces: SceneInterface[] = useMemo(
    () => (model.layers ?? []).flatMap((l, k) => (l.base ? [{ layer: k, points: l.base as Pt[] }] : [])),
    [model.layers],
  );

  const scene: SectionScene = {
    layout,
    raster,
    heatmap,
    surface: (model.surface as Pt[] | undefined) ?? null,
    interfaces,
    showHandles: tool === 'shape' && !readOnly,
    selectedLayer: props.selectedLayer,
    selectedNode: props.selectedNode,
    painted,
    stations: props.stations,
    boreholes: props.boreholes,
    shots: props.shots,
    selectedShot: props.selectedShot,
    preview:
      preview.field && props.previewShot
        ? { source: props.previewShot.source, receivers: props.previewShot.receivers, levels: preview.field.levels, contours: preview.field.contours, rays: preview.rays?.rays ?? null }
        : null,
    overlay:
      gesture?.kind === 'rect'
        ? { kind: 'rect', a: gesture.a, b: gesture.b }
        : hover && (tool === 'brush' || tool === 'erase') && !readOnly
          ? { kind: 'brush', x: hover.x, z: hover.z, r: Math.max(props.brushRadius, raster.grid.dx / 2) }
          : null,
  };

  // Draw on every change; then, once per preview result, record edit → redraw time for the benchmark.
  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas) return;
    const dpr = window.devicePixelRatio || 1;
    if (canvas.width !== Math.round(layout.width * dpr) || canvas.height !== Math.round(layout.height * dpr)) {
      canvas.width = Math.round(layout.width * dpr);
      canvas.height = Math.round(layout.height * dpr);
    }
    const ctx = canvas.getContext('2d');
    if (!ctx) return;
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    const t0 = performance.now();
    drawSection(ctx, scene);
    performance.measure('timefield:section-draw', { start: t0, end: performance.now() });
    const editedAt = preview.editedAt;
    if (preview.field && editedAt !== null && measured.current !== editedAt) {
      measured.current = editedAt;
      try {
        const now = performance.now();
        performance.measure('timefield:preview-redraw', { start: editedAt, end: now });
        // Its parts: edit → sent to the worker, worker round trip, reply → drawn.
        if (preview.sentAt !== null && preview.receivedAt !== null && preview.sentAt >= editedAt) {
          performance.measure('timefield:preview-dispatch', { start: editedAt, end: preview.sentAt });
          performance.measure('timefield:preview-worker', { start: preview.sentAt, end: preview.receivedAt });
          performance.measure('timefield:preview-paint', { start: preview.receivedAt, end: now });
        }
      } catch {
        // an edit older than the page's time origin: nothing to measure
      }
    }
  });

  const toModel = (e: PointerEvent | { clientX: number; clientY: number }): Hover => {
    const rect = canvasRef.current!.getBoundingClientRect();
    const px = e.clientX - rect.left;
    const py = e.clientY - rect.top;
    return { px, py, x: pxToX(layout, px), z: pxToZ(layout, py) };
  };

  function hitNode(px: number, py: number): { layer: number; node: number } | null {
    const order = [...interfaces].sort((a, b) => (a.layer === props.selectedLayer ? -1 : b.layer === props.selectedLayer ? 1 : 0));
    for (const itf of order) {
      for (let i = 0; i < itf.points.length; i++) {
        const [x, z] = itf.points[i];
        if (Math.hypot(xToPx(layout, x) - px, zToPx(layout, z) - py) <= HANDLE_HIT_PX) return { layer: itf.layer, node: i };
      }
    }
    return null;
  }

  function hitLine(px: number, py: number): number | null {
    for (const itf of interfaces) {
      for (let i = 1; i < itf.points.length; i++) {
        const [ax, az] = itf.points[i - 1];
        const [bx, bz] = itf.points[i];
        if (distanceToSegment(px, py, xToPx(layout, ax), zToPx(layout, az), xToPx(layout, bx), zToPx(layout, bz)) <= LINE_HIT_PX) return itf.layer;
      }
    }
    return null;
  }

  function hitShot(px: number, py: number): string | null {
    for (const s of props.shots) if (Math.hypot(xToPx(layout, s.x) - px, zToPx(layout, s.z) - 1 - py) <= 9) return s.id;
    return null;
  }

  function onPointerDown(e: PointerEvent<HTMLCanvasElement>) {
    if (e.button !== 0) return;
    const h = toModel(e);
    canvasRef.current?.focus();
    const shot = tool === 'shape' || readOnly ? hitShot(h.px, h.py) : null;
    if (shot) {
      props.onSelectShot(shot);
      return;
    }
    if (readOnly || !insidePlot(layout, h.px, h.py)) return;
    e.currentTarget.setPointerCapture(e.pointerId);
    if (tool === 'shape') {
      const node = hitNode(h.px, h.py);
      if (node) {
        props.onSelect(node.layer, node.node);
        props.onNodeDrag('start', node.layer, node.node, h.x, h.z);
        setGesture({ kind: 'drag', ...node });
        return;
      }
      const line = hitLine(h.px, h.py);
      props.onSelect(line, null);
      return;
    }
    if (tool === 'rect') {
      setGesture({ kind: 'rect', a: [h.x, h.z], b: [h.x, h.z] });
      return;
    }
    props.onStroke('start', brushCells(raster.grid, h, props.brushRadius));
    setGesture({ kind: 'stroke', last: { x: h.x, z: h.z } });
  }

  function onPointerMove(e: PointerEvent<HTMLCanvasElement>) {
    const h = toModel(e);
    setHover(insidePlot(layout, h.px, h.py) ? h : null);
    if (!gesture) return;
    if (gesture.kind === 'drag') props.onNodeDrag('move', gesture.layer, gesture.node, h.x, h.z);
    else if (gesture.kind === 'rect') setGesture({ ...gesture, b: [h.x, h.z] });
    else {
      props.onStroke('move', brushStrokeCells(raster.grid, gesture.last, h, props.brushRadius));
      setGesture({ kind: 'stroke', last: { x: h.x, z: h.z } });
    }
  }

  function onPointerUp(e: PointerEvent<HTMLCanvasElement>) {
    if (!gesture) return;
    const h = toModel(e);
    if (gesture.kind === 'drag') props.onNodeDrag('end', gesture.layer, gesture.node, h.x, h.z);
    else if (gesture.kind === 'rect') props.onRectangle(rectangleCells(raster.grid, { x: gesture.a[0], z: gesture.a[1] }, h));
    else props.onStroke('end', []);
    setGesture(null);
  }

  function onDoubleClick(e: React.MouseEvent<HTMLCanvasElement>) {
    if (readOnly || tool !== 'shape') return;
    const h = toModel(e);
    if (hitNode(h.px, h.py)) return;
    const line = hitLine(h.px, h.py);
    if (line !== null) props.onInsertNode(line, h.x);
  }

  function onKeyDown(e: KeyboardEvent<HTMLCanvasElement>) {
    if (readOnly) return;
    const step = e.shiftKey ? 10 : 1;
    const moves: Record<string, [number, number]> = { ArrowLeft: [-step, 0], ArrowRight: [step, 0], ArrowUp: [0, step], ArrowDown: [0, -step] };
    if (moves[e.key] && props.selectedNode !== null) {
      e.preventDefault();
      props.onNudge(...moves[e.key]);
    } else if ((e.key === 'Delete' || e.key === 'Backspace') && props.selectedNode !== null) {
      e.preventDefault();
      props.onDeleteNode();
    } else if (e.key === 'Escape') props.onSelect(null, null);
  }

  const cursor = readOnly ? 'default' : tool === 'shape' ? (gesture?.kind === 'drag' ? 'grabbing' : hover && hitNode(hover.px, hover.py) ? 'grab' : 'default') : 'crosshair';

  return (
    <div className="flex w-full gap-3">
      <div ref={boxRef} className="min-w-0 flex-1">
      <canvas
        ref={canvasRef}
        data-testid="section-canvas"
        data-layout={JSON.stringify({ ...layout.plot, xMin: layout.xMin, xMax: layout.xMax, zMin: layout.zMin, zMax: layout.zMax })}
        tabIndex={0}
        role="img"
        aria-label={`Velocity section, x ${layout.xMin} to ${layout.xMax} m, elevation ${+layout.zMin.toFixed(2)} to ${layout.zMax} m. With the shape tool, arrow keys move the selected interface node by one cell (Shift: ten) and Delete removes it.`}
        style={{ width: layout.width, height: layout.height, cursor, touchAction: 'none' }}
        className="block rounded-md bg-white"
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={onPointerUp}
        onPointerCancel={onPointerUp}
        onPointerLeave={() => setHover(null)}
        onDoubleClick={onDoubleClick}
        onKeyDown={onKeyDown}
      />
      <Readout hover={hover} raster={raster} preview={preview} exaggeration={layout.exaggeration} asked={exaggeration} />
      </div>
      <ColourBar range={range} height={layout.plot.height} top={layout.plot.top} />
    </div>
  );
}

function Readout({ hover, raster, preview, exaggeration, asked }: { hover: Hover | null; raster: RasterModel; preview: PreviewState; exaggeration: number; asked: number }) {
  let text = 'Point at the section to read x, z and velocity.';
  if (hover) {
    const node = nearestNode(raster.grid, hover);
    const air = node < 0 || !raster.active[node];
    const v = node >= 0 ? raster.velocity[node] : NaN;
    const vText = air ? 'air' : Number.isFinite(v) && v > 0 ? `${Math.round(v)} m/s` : 'invalid velocity';
    let tText = '';
    if (preview.field && !air && preview.field.times.length === raster.velocity.length) {
      try {
        const t = sampleTime(raster.grid, preview.field.times, raster.active, hover);
        if (Number.isFinite(t)) tText = ` · t ${(t * 1000).toFixed(2)} ms`;
      } catch {
        // outside or in the air: no time to show
      }
    }
    text = `x ${hover.x.toFixed(2)} m · z ${hover.z.toFixed(2)} m · v ${vText}${tText}`;
  }
  return (
    <p data-testid="section-readout" className="mt-1 flex flex-wrap justify-between gap-2 text-sm tabular-nums text-stone-700" aria-live="off">
      <span>{text}</span>
      <span className="text-stone-500" data-testid="section-exaggeration">
        {/* The plot keeps a readable height: on a narrow screen (or a very long line) the drawn exaggeration differs from the one chosen. */}
        {Math.abs(exaggeration - asked) < 0.01
          ? `vertical exaggeration ${asked}×`
          : `drawn at ${+exaggeration.toFixed(2)}× vertical exaggeration, not ${asked}×: at this width a ${asked}× section would be too ${exaggeration > asked ? 'flat' : 'tall'} to read`}
      </span>
    </p>
  );
}
