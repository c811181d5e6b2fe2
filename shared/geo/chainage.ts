/**
 * Stations in map coordinates (easting, northing, m): chainage along the line and the checks a
 * surveyor would make before trusting a station list. The line may bend: chainage is the distance
 * along the polyline through the stations in table order (common practice, no source).
 */
export interface MapPoint {
  easting: number;
  northing: number;
}

/** Chainage of each point along the polyline through them, from `start` at the first. */
export function chainageAlong(points: readonly MapPoint[], start = 0): number[] {
  const out: number[] = [];
  let s = start;
  points.forEach((p, i) => {
    if (i > 0) s += Math.hypot(p.easting - points[i - 1].easting, p.northing - points[i - 1].northing);
    out.push(s);
  });
  return out;
}

export interface CoordinateProblem {
  /** 0-based index of the point the problem shows at. */
  index: number;
  message: string;
}

const median = (v: number[]): number => {
  const s = [...v].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

/** Longer than this many typical spacings (and 5 m more), a step between stations is a jump. */
const JUMP_FACTOR = 3;
/** A turn sharper than this (degrees) between consecutive steps is the line doubling back. */
const MAX_TURN_DEG = 90;

/**
 * A station list whose coordinates double back (a turn of more than 90° between consecutive steps),
 * jump (without chainage: a step over three typical spacings and 5 m longer), repeat a point, or
 * disagree with the chainage given beside them (by more than 0.5 m or 5 % of the step): each problem
 * at its point.
 */
export function coordinateProblems(points: readonly MapPoint[], chainage?: readonly (number | null)[]): CoordinateProblem[] {
  const problems: CoordinateProblem[] = [];
  if (points.length < 2) return problems;
  const steps = points.slice(1).map((p, i) => ({ de: p.easting - points[i].easting, dn: p.northing - points[i].northing }));
  const lengths = steps.map((s) => Math.hypot(s.de, s.dn));
  const typical = median(lengths.filter((l) => l > 0)) || 0;
  steps.forEach((s, i) => {
    const at = i + 1;
    const length = lengths[i];
    if (length === 0) return problems.push({ index: at, message: 'has the same easting and northing as the station before it' });
    // With the chainage given beside them, a long step that agrees with it is a real gap (checked below).
    if (!chainage && typical > 0 && length > JUMP_FACTOR * typical && length > typical + 5) {
      problems.push({ index: at, message: `is ${length.toFixed(1)} m from the station before it, where stations are typically ${typical.toFixed(1)} m apart: a coordinate looks wrong (if the line really skips here, give the chainage x as well)` });
    }
    if (i > 0 && lengths[i - 1] > 0) {
      const prev = steps[i - 1];
      const cos = (prev.de * s.de + prev.dn * s.dn) / (lengths[i - 1] * length);
      const turn = (Math.acos(Math.max(-1, Math.min(1, cos))) * 180) / Math.PI;
      if (turn > MAX_TURN_DEG) problems.push({ index: at, message: `turns the line back by ${turn.toFixed(0)}° from the two stations before it: the stations must follow the line in order` });
    }
    const c0 = chainage?.[at - 1], c1 = chainage?.[at];
    if (c0 != null && c1 != null) {
      const given = c1 - c0;
      if (Math.abs(given - length) > Math.max(0.5, 0.05 * length)) {
        problems.push({ index: at, message: `is ${length.toFixed(2)} m from the station before it by its coordinates but ${given.toFixed(2)} m by its chainage x` });
      }
    }
  });
  return problems;
}
