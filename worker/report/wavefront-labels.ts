/**
 * Where to write the time of each wavefront: on the line, where it meets one of a few guide rays
 * leaving the shot downwards (first towards the longer part of the line), at the first guide that
 * gives a label clear of the others and inside the plot. Levels whose labels would crowd (slow
 * ground near the shot) stay unlabelled rather than overprint. Works in page coordinates, so the
 * vertical exaggeration is already taken into account.
 */
export interface LabelBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface PlacedLabel {
  level: number;
  x: number;
  y: number;
}

/** Page-space lines per level: lines[level] = polylines of x, y pairs. */
export function placeWavefrontLabels(
  lines: { level: number; polylines: number[][] }[],
  shot: { x: number; y: number },
  area: LabelBox,
  size: (level: number) => { w: number; h: number },
  farRight: boolean,
): PlacedLabel[] {
  const side = farRight ? 1 : -1;
  const guides = [
    [side, 35],
    [side, 18],
    [side, 55],
    [-side, 35],
    [-side, 18],
  ].map(([s, deg]) => ({ ux: s * Math.cos((deg * Math.PI) / 180), uy: Math.sin((deg * Math.PI) / 180) }));
  const taken: LabelBox[] = [{ x: shot.x - 8, y: shot.y - 8, w: 16, h: 16 }];
  const placed: PlacedLabel[] = [];
  for (const { level, polylines } of lines) {
    const { w, h } = size(level);
    for (const g of guides) {
      const at = nearestToGuide(polylines, shot, g.ux, g.uy);
      if (!at) continue;
      const box = { x: at.x - w / 2 - 1, y: at.y - h / 2 - 1, w: w + 2, h: h + 2 };
      const inside = box.x >= area.x && box.y >= area.y && box.x + box.w <= area.x + area.w && box.y + box.h <= area.y + area.h;
      if (!inside || taken.some((t) => overlap(t, box, 2))) continue;
      taken.push(box);
      placed.push({ level, x: at.x, y: at.y });
      break;
    }
  }
  return placed;
}

/** The vertex closest to the half-line from `from` along (ux, uy). */
function nearestToGuide(polylines: number[][], from: { x: number; y: number }, ux: number, uy: number): { x: number; y: number } | null {
  let best: { x: number; y: number } | null = null;
  let bestD = 6; // pt: further from the guide than this and the guide misses the line
  for (const p of polylines) {
    for (let i = 0; i + 1 < p.length; i += 2) {
      const dx = p[i] - from.x;
      const dy = p[i + 1] - from.y;
      if (dx * ux + dy * uy <= 0) continue;
      const across = Math.abs(dx * uy - dy * ux);
      if (across < bestD) {
        bestD = across;
        best = { x: p[i], y: p[i + 1] };
      }
    }
  }
  return best;
}

function overlap(a: LabelBox, b: LabelBox, pad: number): boolean {
  return a.x < b.x + b.w + pad && b.x < a.x + a.w + pad && a.y < b.y + b.h + pad && b.y < a.y + a.h + pad;
}
