import type { RasterModel } from './rasterise';

/** Velocities outside this range are unusual at engineering-site depths: warn, do not refuse (common practice, no source). */
export const USUAL_VELOCITY_RANGE = { min: 100, max: 7000 } as const;

export interface RasterSummary {
  nodes: number;
  activeNodes: number;
  /** m/s over ground nodes; null when there are none. */
  vMin: number | null;
  vMax: number | null;
  warnings: string[];
}

/** Size, velocity range and plain-words warnings of a rasterised model (ground nodes only). */
export function summariseRaster(raster: RasterModel): RasterSummary {
  const { velocity, active } = raster;
  let vMin = Infinity;
  let vMax = -Infinity;
  let activeNodes = 0;
  let slow = 0;
  let fast = 0;
  for (let i = 0; i < velocity.length; i++) {
    if (!active[i]) continue;
    const v = velocity[i];
    activeNodes++;
    if (v < vMin) vMin = v;
    if (v > vMax) vMax = v;
    if (v < USUAL_VELOCITY_RANGE.min) slow++;
    else if (v > USUAL_VELOCITY_RANGE.max) fast++;
  }
  const warnings: string[] = [];
  if (slow) warnings.push(`${slow} ground nodes are slower than ${USUAL_VELOCITY_RANGE.min} m/s (slowest ${Math.round(vMin)} m/s): unusual for soil or rock.`);
  if (fast) warnings.push(`${fast} ground nodes are faster than ${USUAL_VELOCITY_RANGE.max} m/s (fastest ${Math.round(vMax)} m/s): unusual at engineering-site depths.`);
  if (!activeNodes) warnings.push('The ground surface lies above the whole grid: no node carries waves.');
  return { nodes: velocity.length, activeNodes, vMin: activeNodes ? vMin : null, vMax: activeNodes ? vMax : null, warnings };
}
