import { useEffect, useMemo, useRef, useState, type MouseEvent } from 'react';
import type { Grid } from '../../../../shared/grid';
import { sToMs } from '../../../../shared/units';
import { drawSection, type SectionScene } from './drawSection';
import { sampleNearest, sectionFrame } from './sectionScale';
import { velocityPixels } from './velocityColours';

/** What is drawn over the velocities; the parent memoises it, so the canvas redraws only when it changes. */
export type SectionOverlay = Omit<SectionScene, 'image' | 'vRange' | 'grid'>;

interface SectionCanvasProps {
  overlay: SectionOverlay;
  velocity: { grid: Grid; values: Float32Array };
  field: { grid: Grid; values: Float32Array } | null;
  width: number;
  exaggeration: number;
  label: string;
  /** The velocity colour range (m/s). */
  colourRange: { min: number; max: number };
}

/** One pixel per node: built once per model version, then scaled onto the section by drawImage. */
function useVelocityImage(velocity: { grid: Grid; values: Float32Array }, range: { min: number; max: number }) {
  return useMemo(() => {
    const canvas = document.createElement('canvas');
    canvas.width = velocity.grid.nx;
    canvas.height = velocity.grid.nz;
    const pixels = velocityPixels(velocity.values, range);
    canvas.getContext('2d')?.putImageData(new ImageData(pixels, velocity.grid.nx, velocity.grid.nz), 0, 0);
    return { canvas, range };
  }, [velocity, range]);
}

/**
 * The section drawn on a canvas: a shot change redraws in a few milliseconds, with no chart library
 * to load. Moving the pointer reads out position, velocity and first-arrival time below the drawing.
 */
export function SectionCanvas({ velocity, field, width, exaggeration, label, overlay, colourRange }: SectionCanvasProps) {
  const ref = useRef<HTMLCanvasElement>(null);
  const image = useVelocityImage(velocity, colourRange);
  const frame = useMemo(() => sectionFrame(velocity.grid, width, exaggeration), [velocity.grid, width, exaggeration]);
  const [readout, setReadout] = useState<string | null>(null);

  useEffect(() => {
    const canvas = ref.current;
    const ctx = canvas?.getContext('2d');
    if (!canvas || !ctx) return;
    const dpr = window.devicePixelRatio || 1;
    canvas.width = Math.round(frame.width * dpr);
    canvas.height = Math.round(frame.height * dpr);
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    drawSection(ctx, { ...overlay, grid: velocity.grid, image: image.canvas, vRange: image.range }, width, exaggeration);
  }, [frame, image, overlay, velocity.grid, width, exaggeration]);

  const onMove = (e: MouseEvent<HTMLCanvasElement>) => {
    const box = e.currentTarget.getBoundingClientRect();
    const { x, z } = frame.toModel(e.clientX - box.left, e.clientY - box.top);
    if (x < frame.xMin || x > frame.xMax || z < frame.zMin || z > frame.zMax) return setReadout(null);
    const v = sampleNearest(velocity.values, velocity.grid, x, z);
    const t = field ? sampleNearest(field.values, field.grid, x, z) : Number.NaN;
    const place = `x ${x.toFixed(1)} m, elevation ${z.toFixed(1)} m`;
    setReadout(Number.isFinite(v) ? `${place} · v ${Math.round(v)} m/s${Number.isFinite(t) ? ` · first arrival ${sToMs(t).toFixed(1)} ms` : ''}` : `${place} · air`);
  };

  return (
    <div>
      <canvas
        ref={ref}
        role="img"
        aria-label={label}
        data-testid="section-canvas"
        style={{ width: frame.width, height: frame.height, display: 'block' }}
        onMouseMove={onMove}
        onMouseLeave={() => setReadout(null)}
      />
      <p data-testid="section-readout" className="h-6 text-sm tabular-nums text-stone-700">
        {readout ?? 'Point at the section to read position, velocity and first-arrival time.'}
      </p>
    </div>
  );
}
