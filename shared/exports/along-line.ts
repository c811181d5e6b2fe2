import type { ExportStation } from './section';

/**
 * Map position (easting, northing) of a chainage, by linear interpolation between the stations on
 * either side, extended along the end segments beyond the first and last station; null when the
 * stations carry no coordinates. A line that bends is followed segment by segment.
 */
export function mapPositionAt(stations: readonly ExportStation[], x: number): [number, number] | null {
  const located = stations.filter((s) => s.easting !== undefined && s.northing !== undefined).sort((a, b) => a.x - b.x);
  if (located.length < 2) return null;
  let k = 1;
  while (k < located.length - 1 && located[k].x < x) k++;
  const a = located[k - 1], b = located[k];
  const f = (x - a.x) / (b.x - a.x);
  return [a.easting! + f * (b.easting! - a.easting!), a.northing! + f * (b.northing! - a.northing!)];
}
