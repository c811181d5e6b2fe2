/**
 * Intercept-time method on each shot's refractor branches (Telford, Geldart & Sheriff 1990,
 * Applied Geophysics, 2nd ed., §4.3): a straight line t = t_i + s·offset per branch; with the
 * opposite branches over the same geophones, the critical angle and dip of a planar refractor
 *   i_c = ½[asin(V1·s_f) + asin(V1·s_r)],  δ = ½[asin(V1·s_f) − asin(V1·s_r)],  V2 = V1 / sin i_c
 * (s_f, s_r the slownesses of the forward and reverse branches; δ > 0 deepens toward +x), and
 * the depth normal to the refractor under the shot h = t_i·V1 / (2 cos i_c). For the second
 * refractor of three layers the layers are taken as flat (V3 from the mean slowness) and the
 * top layer is stripped off (§4.3, multilayer formula).
 */
import type { Branch } from './branches';
import { leastSquares, median } from './robust-line';

export interface BranchLine {
  branch: Branch;
  /** Time-depth under the shot (half the intercept time, s), dip (rad, > 0 deepening to +x). */
  timeDepth: number;
  dip: number;
}

export interface InterceptRefractor {
  velocity: number;
  lines: BranchLine[];
}

/**
 * `above` is the velocity of the layer above for the dip formula (the top layer's for the first
 * refractor); deeper refractors are taken as flat.
 */
export function interceptRefractor(branches: readonly Branch[], above: number, dipping: boolean): InterceptRefractor {
  const fits = branches.map((b) => {
    const offsets = Float64Array.from(b.x, (x) => Math.abs(x - b.sourceX));
    const f = leastSquares(offsets, b.t);
    return { branch: b, slowness: f.slope, intercept: f.intercept };
  });
  const velocities: number[] = [];
  const lines: BranchLine[] = [];
  for (const f of fits) {
    // The opposite branches over the same ground: the reverse slowness of this branch's refractor.
    const lo = f.branch.x[0], hi = f.branch.x[f.branch.x.length - 1];
    const opposite = fits.filter((o) => o.branch.direction !== f.branch.direction && o.branch.x[0] < hi && o.branch.x[o.branch.x.length - 1] > lo);
    if (!opposite.length) continue;
    const sOther = median(opposite.map((o) => o.slowness));
    const [sf, sr] = f.branch.direction === 1 ? [f.slowness, sOther] : [sOther, f.slowness];
    let dip = 0, velocity: number;
    if (dipping) {
      const a = Math.asin(Math.min(1, above * sf)), b = Math.asin(Math.min(1, above * sr));
      velocity = above / Math.sin((a + b) / 2);
      dip = (a - b) / 2;
    } else {
      velocity = 2 / (sf + sr);
    }
    velocities.push(velocity);
    lines.push({ branch: f.branch, timeDepth: f.intercept / 2, dip });
  }
  return { velocity: median(velocities), lines };
}
