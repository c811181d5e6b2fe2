/** A project's plan as data, and the geometry both the page (SVG) and the DXF writer use. */
import type { ExportStation } from './section';

export interface PlanLine {
  id: string;
  name: string;
  stations: ExportStation[];
  shots: { id: string; x: number; z: number }[];
  holes: { name: string; kind: 'borehole' | 'trial_pit'; x: number; groundZ: number | null }[];
}

export interface Plan {
  project: string;
  crs: string | null;
  lines: PlanLine[];
}

/** Lines with at least two stations in map coordinates (the others cannot be drawn in plan). */
export const mappedLines = (plan: Plan): PlanLine[] => plan.lines.filter((l) => l.stations.filter((s) => s.easting !== undefined).length >= 2);

/** A round scale-bar length near a fifth of the extent (1, 2 or 5 × 10^k m). */
export function scaleBarLength(extent: number): number {
  const raw = Math.max(extent, 1) / 5;
  const p = 10 ** Math.floor(Math.log10(raw));
  return [1, 2, 5, 10].map((m) => m * p).filter((v) => v <= raw).pop() ?? p;
}

export function planExtent(lines: readonly PlanLine[]): { e0: number; e1: number; n0: number; n1: number } {
  const pts = lines.flatMap((l) => l.stations.filter((s) => s.easting !== undefined).map((s) => [s.easting!, s.northing!]));
  const es = pts.map((p) => p[0]), ns = pts.map((p) => p[1]);
  return { e0: Math.min(...es), e1: Math.max(...es), n0: Math.min(...ns), n1: Math.max(...ns) };
}

