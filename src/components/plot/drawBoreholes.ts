import type { BoreholeView } from '../../../shared/schemas/boreholes';

export type SectionHole = Pick<BoreholeView, 'name' | 'kind' | 'x' | 'groundZResolved' | 'waterDepth' | 'contacts'>;

const INK = '#1c1917';
const ROCK = '#b45309';
const WATER = '#1d4ed8';
const FONT = '12px "Source Sans 3", ui-sans-serif, system-ui, sans-serif';

/**
 * Boreholes and trial pits on any section: a narrow column from the ground to the deepest contact,
 * a tick at each logged contact (the top of rock heavier, in amber), a small blue triangle at the
 * water level, the name above. `toPx` maps (x, elevation) in metres to the canvas. Holes whose ground
 * is unknown are left out. Used by the model editor, run and inversion sections alike.
 */
export function drawBoreholes(ctx: CanvasRenderingContext2D, holes: readonly SectionHole[], toPx: (x: number, z: number) => [number, number]): void {
  ctx.save();
  ctx.font = FONT;
  ctx.textAlign = 'center';
  for (const h of holes) {
    const ground = h.groundZResolved;
    if (ground === null || !h.contacts.length) continue;
    const deepest = Math.max(0.5, ...h.contacts.map((c) => c.depth));
    const [px, top] = toPx(h.x, ground);
    const [, bottom] = toPx(h.x, ground - deepest);
    const half = h.kind === 'trial_pit' ? 5 : 3;
    ctx.fillStyle = 'rgba(255,255,255,0.85)';
    ctx.fillRect(px - half, top, 2 * half, bottom - top);
    ctx.strokeStyle = INK;
    ctx.lineWidth = 1;
    ctx.strokeRect(px - half + 0.5, top, 2 * half - 1, bottom - top);
    for (const c of h.contacts) {
      if (c.depth === 0) continue;
      const [, y] = toPx(h.x, ground - c.depth);
      ctx.strokeStyle = c.rockTop ? ROCK : INK;
      ctx.lineWidth = c.rockTop ? 3 : 1.5;
      ctx.beginPath();
      ctx.moveTo(px - half - (c.rockTop ? 7 : 4), y);
      ctx.lineTo(px + half + (c.rockTop ? 7 : 4), y);
      ctx.stroke();
    }
    if (h.waterDepth !== null) {
      const [, y] = toPx(h.x, ground - h.waterDepth);
      ctx.fillStyle = WATER;
      ctx.beginPath();
      ctx.moveTo(px + half + 3, y - 6);
      ctx.lineTo(px + half + 13, y - 6);
      ctx.lineTo(px + half + 8, y);
      ctx.closePath();
      ctx.fill();
    }
    ctx.fillStyle = INK;
    ctx.textBaseline = 'bottom';
    ctx.lineWidth = 3;
    ctx.strokeStyle = 'rgba(255,255,255,0.9)';
    ctx.strokeText(h.name, px, top - 3);
    ctx.fillText(h.name, px, top - 3);
  }
  ctx.restore();
}
