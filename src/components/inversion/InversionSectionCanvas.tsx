import { useEffect, useMemo, useRef, useState, type MouseEvent } from 'react';
import type { Grid } from '../../../shared/grid';
import type { Station } from '../../api/types';
import { drawSection } from '../run/section/drawSection';
import { sampleNearest, sectionFrame } from '../run/section/sectionScale';
import { velocityPixels } from '../run/section/velocityColours';
import type { Wavefronts } from '../run/section/wavefronts';
import { greyMaskedPixels } from './coverageMask';
import { drawDoi } from './drawDoi';
import type { SectionHole } from '../plot/drawBoreholes';

export interface InversionSectionScene {
  grid: Grid;
  /** m/s per node, NaN in the air. */
  velocity: Float32Array;
  /** Colour range; the comparison page passes one range to both sections. */
  range: { min: number; max: number };
  /** 1 = greyed (too little ray); null = no mask (a forward run's model). */
  mask: Uint8Array | null;
  /** Summed ray length per node (m), for the read-out; null when unknown. */
  coverage: Float32Array | null;
  contours: Wavefronts | null;
  doi: [number, number][][];
  surface: [number, number][] | null;
  stations: { x: number; z: number }[];
  shots: { shotId: string; x: number; z: number }[];
  /** The line's boreholes and trial pits (none on a comparison). */
  boreholes?: readonly SectionHole[];
}

/**
 * An inversion's velocity section on a canvas, drawn with the run section's drawing (same colours,
 * axes, colour bar, stations and shots), with the coverage mask baked into the image and the
 * depth-of-investigation line on top. The pointer reads out position, velocity and ray coverage.
 */
export function InversionSectionCanvas({ scene, width, exaggeration, label, testId = 'inversion-section-canvas' }: { scene: InversionSectionScene; width: number; exaggeration: number; label: string; testId?: string }) {
  const ref = useRef<HTMLCanvasElement>(null);
  const [readout, setReadout] = useState<string | null>(null);
  const image = useMemo(() => {
    const canvas = document.createElement('canvas');
    canvas.width = scene.grid.nx;
    canvas.height = scene.grid.nz;
    const pixels = velocityPixels(scene.velocity, scene.range);
    if (scene.mask) greyMaskedPixels(pixels, scene.mask);
    canvas.getContext('2d')?.putImageData(new ImageData(pixels, scene.grid.nx, scene.grid.nz), 0, 0);
    return canvas;
  }, [scene.grid, scene.velocity, scene.range, scene.mask]);
  const frame = useMemo(() => sectionFrame(scene.grid, width, exaggeration), [scene.grid, width, exaggeration]);

  useEffect(() => {
    const canvas = ref.current;
    const ctx = canvas?.getContext('2d');
    if (!canvas || !ctx) return;
    const dpr = window.devicePixelRatio || 1;
    canvas.width = Math.round(frame.width * dpr);
    canvas.height = Math.round(frame.height * dpr);
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    const stations: Station[] = scene.stations.map((s) => ({ station: 0, x: s.x, z: s.z }));
    const f = drawSection(
      ctx,
      { grid: scene.grid, image, vRange: scene.range, fronts: scene.contours, rays: [], highlightPick: null, surface: scene.surface, layerBases: [], stations, shots: scene.shots, selectedShot: null, boreholes: scene.boreholes },
      width,
      exaggeration,
    );
    drawDoi(ctx, f, scene.doi);
  }, [frame, image, scene, width, exaggeration]);

  const onMove = (e: MouseEvent<HTMLCanvasElement>) => {
    const box = e.currentTarget.getBoundingClientRect();
    const { x, z } = frame.toModel(e.clientX - box.left, e.clientY - box.top);
    if (x < frame.xMin || x > frame.xMax || z < frame.zMin || z > frame.zMax) return setReadout(null);
    const v = sampleNearest(scene.velocity, scene.grid, x, z);
    const place = `x ${x.toFixed(1)} m, elevation ${z.toFixed(1)} m`;
    if (!Number.isFinite(v)) return setReadout(`${place} · air`);
    const c = scene.coverage ? sampleNearest(scene.coverage, scene.grid, x, z) : Number.NaN;
    setReadout(`${place} · v ${Math.round(v)} m/s${Number.isFinite(c) ? ` · ${c.toFixed(1)} m of ray` : ''}`);
  };

  return (
    <div>
      <canvas
        ref={ref}
        role="img"
        aria-label={label}
        data-testid={testId}
        style={{ width: frame.width, height: frame.height, display: 'block' }}
        onMouseMove={onMove}
        onMouseLeave={() => setReadout(null)}
      />
      <p className="min-h-6 text-sm tabular-nums text-stone-700" data-testid={`${testId}-readout`}>
        {readout ?? 'Point at the section to read position, velocity and ray coverage.'}
      </p>
    </div>
  );
}
