/**
 * The automatic split of the travel-time curves made again on the curves reduced to a flat datum
 * (elevation statics; common practice, no source), for reading the refractor velocities. On uneven
 * ground a curve's slope breaks carry the ground's shape as well as the layers', so the split as the
 * curves stand puts a few picks on the wrong side near the breaks, and the reversed pairs left give a
 * biased minus-time slope (measured: a refractor velocity 6–7 % high under ±2.5 m of topography over
 * a 6 m undulation; −0.7 to −1.5 % read on this split; docs/interpretation.md). The curves are split
 * as they stand first; every source and geophone is then moved down to the lowest ground of the line
 * along the head wave's path in the top layer, t' = t − (z − z_datum)·cos i / V1 with sin i = V1 / V
 * (V of the first refractor from that split; one static per station, as for a whole trace), and the
 * curves are split again. Delay times, and so depths, still come from the split as the curves stand,
 * which places the picks near the breaks better on these surveys.
 */
import { assignRefractors } from './assign';
import { lineGeophones, refractorBranches, reversedPairs } from './branches';
import { directVelocity } from './overburden';
import { plusMinus } from './plus-minus';
import type { Assignment, LayerShot } from './types';

/** `first`: the split as the curves stand, when the caller has it already. */
export function suggestAssignment(shots: readonly LayerShot[], layers: number, first: Assignment = assignRefractors(shots, layers)): Assignment {
  const v1 = directVelocity(shots, first);
  if (!Number.isFinite(v1)) return first;
  const geophones = lineGeophones(shots);
  const speeds = [v1];
  for (let n = 1; n < layers; n++) {
    const pairs = reversedPairs(refractorBranches(shots, first, n), geophones);
    speeds.push(pairs.length ? plusMinus(pairs).velocity : Number.NaN);
  }
  let datum = Infinity;
  for (const s of shots) {
    datum = Math.min(datum, s.source.z);
    for (let i = 0; i < s.times.length; i++) datum = Math.min(datum, s.receivers[2 * i + 1]);
  }
  if (!Number.isFinite(datum) || !(speeds[1] > v1)) return first;
  const cos = Math.sqrt(1 - (v1 / speeds[1]) ** 2);
  const reduced = shots.map((s) => ({
    ...s,
    times: s.times.map((t, i) => t - (s.receivers[2 * i + 1] - datum + (s.source.z - datum)) * (cos / v1)),
  }));
  return assignRefractors(reduced, layers);
}
