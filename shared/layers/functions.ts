/**
 * The curves a geophysicist checks a delay-time interpretation by (Palmer 1980, 1981; Hagedoorn
 * 1959 at XY = 0): per reversed shot pair A–B and geophone G,
 *   velocity-analysis function  t_V = (t_AY − t_BX + t_AB) / 2   (its slope is 1 / V),
 *   time-depth                  t_G = (t_AY + t_BX − (t_AB + XY / V)) / 2,
 * with X = G − XY/2 and Y = G + XY/2; at XY = 0 these are T⁻/2 + t_AB and T⁺/2 of the plus–minus
 * method. Only for drawing: the interpretation itself pools the pairs (plus-minus.ts, grm.ts).
 */
import { timeAt, type ReversedPair } from './branches';
import type { LayerShot, PairFunctions } from './types';

export function pairFunctions(pairs: readonly ReversedPair[], geophones: readonly number[], xy: number, velocity: number, shots: readonly LayerShot[]): PairFunctions[] {
  const out: PairFunctions[] = [];
  for (const p of pairs) {
    const x: number[] = [];
    const velocityFn: number[] = [];
    const timeDepth: number[] = [];
    for (const g of geophones) {
      if (g <= p.forward.sourceX || g >= p.reverse.sourceX) continue;
      const ty = timeAt(p.forward, g + xy / 2);
      const tx = timeAt(p.reverse, g - xy / 2);
      if (!Number.isFinite(ty) || !Number.isFinite(tx)) continue;
      x.push(g);
      velocityFn.push((ty - tx + p.reciprocal) / 2);
      timeDepth.push((ty + tx - (p.reciprocal + xy / velocity)) / 2);
    }
    if (x.length) out.push({ forwardShot: shots[p.forward.shot].shotId, reverseShot: shots[p.reverse.shot].shotId, x, velocityFn, timeDepth });
  }
  return out;
}
