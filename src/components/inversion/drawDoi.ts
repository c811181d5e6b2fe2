import type { SectionFrame } from '../run/section/sectionScale';

/** The depth-of-investigation line's look: a dark dash, distinct from contours (thin, solid) and the ground (solid). */
export const DOI_COLOUR = '#7c2d12';
export const DOI_DASH = [10, 5];

/** Draw the depth-of-investigation runs (m) over the section, clipped to the plot. */
export function drawDoi(ctx: CanvasRenderingContext2D, f: SectionFrame, runs: readonly (readonly [number, number])[][]): void {
  const { plot } = f;
  ctx.save();
  ctx.beginPath();
  ctx.rect(plot.left, plot.top, plot.width, plot.height);
  ctx.clip();
  ctx.beginPath();
  for (const run of runs) {
    run.forEach(([x, z], i) => {
      const [px, py] = f.toPx(x, z);
      if (i === 0) ctx.moveTo(px, py);
      else ctx.lineTo(px, py);
    });
  }
  ctx.setLineDash(DOI_DASH);
  ctx.strokeStyle = DOI_COLOUR;
  ctx.lineWidth = 2.5;
  ctx.stroke();
  ctx.restore();
}
