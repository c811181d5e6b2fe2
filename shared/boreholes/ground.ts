/**
 * The ground elevation at a position along the line from the station table: linear between the two
 * stations either side, exact at a station, null outside the stations (no extrapolation).
 */
export function groundAt(stations: readonly { x: number; z: number }[], x: number): number | null {
  const sorted = [...stations].sort((a, b) => a.x - b.x);
  if (!sorted.length || x < sorted[0].x || x > sorted[sorted.length - 1].x) return null;
  for (let i = 1; i < sorted.length; i++) {
    const a = sorted[i - 1], b = sorted[i];
    if (x <= b.x) return b.x === a.x ? b.z : a.z + ((x - a.x) / (b.x - a.x)) * (b.z - a.z);
  }
  return sorted[0].z;
}
