import { useEffect, useRef, useState, type KeyboardEvent } from 'react';
import { drawRecord, type RecordDrawing } from './drawRecord';
import { panView, plotBox, timeAtY, traceAtX, traceSpacing, zoomView, type RecordView } from './recordGeometry';

export interface RecordCanvasProps {
  drawing: RecordDrawing;
  height: number;
  onView: (view: RecordView) => void;
  /** A click (not a drag) on a trace: its index and the display time under the pointer (ms). */
  onClickAt: (trace: number, displayMs: number) => void;
  onKeyDown: (e: KeyboardEvent) => void;
  label: string;
}

/** Pointer travel (px) that turns a press into a drag (pan) rather than a click (pick). */
const DRAG_PX = 4;

/**
 * The record on a canvas: click to pick, drag to pan, wheel to zoom time (Shift + wheel: traces).
 * Focusable, so the keyboard picks too (the page handles the keys).
 */
export function RecordCanvas({ drawing, height, onView, onClickAt, onKeyDown, label }: RecordCanvasProps) {
  const wrap = useRef<HTMLDivElement>(null);
  const canvas = useRef<HTMLCanvasElement>(null);
  const [width, setWidth] = useState(0);
  const press = useRef<{ x: number; y: number; view: RecordView; dragging: boolean } | null>(null);
  const latest = useRef({ drawing, onView });
  latest.current = { drawing, onView };

  useEffect(() => {
    const el = wrap.current;
    if (!el) return;
    const observer = new ResizeObserver(() => setWidth(Math.floor(el.clientWidth)));
    observer.observe(el);
    setWidth(Math.floor(el.clientWidth));
    return () => observer.disconnect();
  }, []);

  useEffect(() => {
    const c = canvas.current;
    if (!c || width <= 0) return;
    const frame = requestAnimationFrame(() => {
      const dpr = window.devicePixelRatio || 1;
      if (c.width !== Math.round(width * dpr) || c.height !== Math.round(height * dpr)) {
        c.width = Math.round(width * dpr);
        c.height = Math.round(height * dpr);
      }
      const ctx = c.getContext('2d');
      if (!ctx) return;
      ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
      drawRecord(ctx, width, height, drawing);
    });
    return () => cancelAnimationFrame(frame);
  }, [drawing, width, height]);

  // Wheel zoom must cancel the page scroll, which React's passive wheel listener cannot do.
  useEffect(() => {
    const c = canvas.current;
    if (!c) return;
    const onWheel = (e: WheelEvent) => {
      const { drawing: d, onView: set } = latest.current;
      const box = plotBox(c.clientWidth, c.clientHeight);
      const r = c.getBoundingClientRect();
      const factor = Math.exp(Math.sign(e.deltaY) * 0.15);
      e.preventDefault();
      if (e.shiftKey) set(zoomView(d.view, 'traces', factor, traceAtX(box, d.view, e.clientX - r.left)));
      else set(zoomView(d.view, 'time', factor, timeAtY(box, d.view, e.clientY - r.top)));
    };
    c.addEventListener('wheel', onWheel, { passive: false });
    return () => c.removeEventListener('wheel', onWheel);
  }, []);

  const local = (e: React.PointerEvent) => {
    const r = canvas.current!.getBoundingClientRect();
    return { x: e.clientX - r.left, y: e.clientY - r.top };
  };

  return (
    <div
      ref={wrap}
      tabIndex={0}
      role="application"
      aria-label={label}
      aria-roledescription="seismogram"
      onKeyDown={onKeyDown}
      data-testid="record-canvas"
      className="relative w-full touch-none rounded-lg border border-stone-300 bg-white focus-visible:outline-3 focus-visible:outline-accent-600"
    >
      <canvas
        ref={canvas}
        style={{ width: '100%', height, display: 'block', cursor: press.current?.dragging ? 'grabbing' : 'crosshair' }}
        onPointerDown={(e) => {
          const p = local(e);
          press.current = { ...p, view: drawing.view, dragging: false };
          e.currentTarget.setPointerCapture(e.pointerId);
        }}
        onPointerMove={(e) => {
          const start = press.current;
          if (!start) return;
          const p = local(e);
          if (!start.dragging && Math.hypot(p.x - start.x, p.y - start.y) < DRAG_PX) return;
          start.dragging = true;
          const box = plotBox(width, height);
          const msPerPx = (start.view.t1 - start.view.t0) / box.height;
          onView(panView(start.view, -(p.x - start.x) / traceSpacing(box, start.view), -(p.y - start.y) * msPerPx));
        }}
        onPointerUp={(e) => {
          const start = press.current;
          press.current = null;
          if (!start || start.dragging) return;
          const p = local(e);
          const box = plotBox(width, height);
          if (p.x < box.left || p.y < box.top || p.x > box.left + box.width || p.y > box.top + box.height) return;
          const trace = Math.round(traceAtX(box, drawing.view, p.x));
          if (trace < 0 || trace >= drawing.traces.length) return;
          onClickAt(trace, timeAtY(box, drawing.view, p.y));
        }}
        onPointerCancel={() => {
          press.current = null;
        }}
      />
    </div>
  );
}
