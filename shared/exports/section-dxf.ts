/**
 * A section as a DXF drawing for CAD (issue 19 item 2), through the dxf-writer package: chainage
 * along x and elevation along y, in metres, at true scale (no vertical exaggeration), one DXF layer
 * per kind of thing so a drafter can switch each on or off. Text heights scale with the section so
 * labels stay readable at any line length.
 */
import Drawing from 'dxf-writer';
import { nodeX } from '../grid';
import { contourLines } from '../geometry/contour-lines';
import { velocityColour } from '../colour/velocity-scale';
import { INTERPRETATION_CAUTION } from './csv';
import type { ExportSection } from './section';

/** Layer names: our own, prefixed so they sort together in a drawing with other layers. */
export const SECTION_LAYERS = {
  ground: 'TF_GROUND',
  interfaces: 'TF_INTERFACES',
  velocity: 'TF_ISOVELOCITY',
  labels: 'TF_ISOVELOCITY_LABELS',
  holes: 'TF_BOREHOLES',
  stations: 'TF_STATIONS',
  shots: 'TF_SHOTS',
  doi: 'TF_DEPTH_OF_INVESTIGATION',
  lowCoverage: 'TF_LOW_COVERAGE',
  title: 'TF_TITLE',
} as const;

const rgb = (c: readonly [number, number, number]) => (Math.round(c[0]) << 16) | (Math.round(c[1]) << 8) | Math.round(c[2]);

/** Velocity levels every `step` m/s inside the section's range (a nice step giving 4–10 lines when not given). */
export function autoLevels(velocity: ArrayLike<number>): number[] {
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < velocity.length; i++) if (Number.isFinite(velocity[i])) [lo, hi] = [Math.min(lo, velocity[i]), Math.max(hi, velocity[i])];
  if (!(hi > lo)) return [];
  const raw = (hi - lo) / 6;
  const p = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * p).find((s) => s >= raw) ?? 10 * p;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v < hi; v += step) if (v > lo) out.push(+v.toFixed(6));
  return out;
}

const pairs = (flat: number[]): [number, number][] => Array.from({ length: flat.length / 2 }, (_, k) => [flat[2 * k], flat[2 * k + 1]]);

export interface SectionDxfOptions {
  /** Iso-velocity levels to draw (m/s); default autoLevels. */
  levels?: number[];
  /** Colours of the velocity levels: the project's scale range. */
  colourRange: { min: number; max: number };
}

export function sectionDxf(section: ExportSection, options: SectionDxfOptions): string {
  const { grid, velocity } = section;
  const d = new Drawing();
  d.setUnits('Meters');
  const xMin = grid.x0, xMax = nodeX(grid, grid.nx - 1);
  const zBottom = grid.z0 - (grid.nz - 1) * grid.dz;
  const h = Math.max(0.2, +((xMax - xMin) / 250).toFixed(2)); // text height, m
  const L = SECTION_LAYERS;
  d.addLayer(L.ground, Drawing.ACI.WHITE, 'CONTINUOUS');
  d.addLayer(L.interfaces, Drawing.ACI.WHITE, 'DASHED');
  d.addLayer(L.labels, Drawing.ACI.WHITE, 'CONTINUOUS');
  d.addLayer(L.holes, Drawing.ACI.WHITE, 'CONTINUOUS');
  d.addLayer(L.stations, Drawing.ACI.GREEN, 'CONTINUOUS');
  d.addLayer(L.shots, Drawing.ACI.RED, 'CONTINUOUS');
  d.addLayer(L.title, Drawing.ACI.WHITE, 'CONTINUOUS');

  d.setActiveLayer(L.ground).drawPolyline(section.surface);
  d.setActiveLayer(L.interfaces);
  for (const f of section.interfaces) {
    d.drawPolyline(f.points);
    const [x, z] = f.points[Math.floor(f.points.length / 2)];
    d.drawText(x, z + 0.5 * h, h, 0, `base of ${f.name}`, 'center');
  }

  // Iso-velocity contours, one DXF layer per level coloured as the product's scale, labelled in m/s.
  const levels = options.levels ?? autoLevels(velocity);
  for (const level of levels) {
    const name = `${L.velocity}_${Math.round(level)}`;
    d.addLayer(name, Drawing.ACI.WHITE, 'CONTINUOUS').setTrueColor(rgb(velocityColour(level, options.colourRange)));
    d.setActiveLayer(name);
    const lines = contourLines(velocity, grid, level);
    for (const line of lines) if (line.length >= 4) d.drawPolyline(pairs(line));
    const longest = lines.reduce<number[] | null>((a, b) => (!a || b.length > a.length ? b : a), null);
    if (longest && longest.length >= 4) {
      const k = 2 * Math.floor(longest.length / 4);
      d.setActiveLayer(L.labels).drawText(longest[k], longest[k + 1], h, 0, `${Math.round(level)} m/s`, 'center', 'middle');
    }
  }

  // Coverage: the depth of investigation and the outline of poorly covered ground, or a note that there is none.
  const notes: string[] = [];
  if (section.coverage && section.doi) {
    d.addLayer(L.doi, Drawing.ACI.MAGENTA, 'DASHED').setActiveLayer(L.doi);
    let run: [number, number][] = [];
    for (let ix = 0; ix <= grid.nx; ix++) {
      const z = ix < grid.nx ? section.doi[ix] : Number.NaN;
      if (Number.isFinite(z)) run.push([nodeX(grid, ix), z]);
      else {
        if (run.length >= 2) d.drawPolyline(run);
        run = [];
      }
    }
    d.addLayer(L.lowCoverage, Drawing.ACI.CYAN, 'DOTTED').setActiveLayer(L.lowCoverage);
    const field = Float32Array.from(section.coverage, (c, i) => (Number.isFinite(velocity[i]) ? c : Number.NaN));
    for (const line of contourLines(field, grid, section.coverageThreshold)) if (line.length >= 4) d.drawPolyline(pairs(line));
    notes.push(`Dashed magenta: depth of investigation (deepest ray). Dotted cyan: ground crossed by less than ${section.coverageThreshold} m of ray, not resolved.`);
  } else {
    notes.push('No ray coverage: this section is a model, not an inversion, so no depth of investigation or poorly covered ground is drawn.');
  }

  // Boreholes: a column from the ground with a tick and the material at each logged contact.
  d.setActiveLayer(L.holes);
  for (const hole of section.holes) {
    if (hole.groundZ === null) continue;
    const bottom = hole.contacts.length ? hole.groundZ - hole.contacts[hole.contacts.length - 1].depth : hole.groundZ - 1;
    d.drawLine(hole.x, hole.groundZ, hole.x, bottom);
    d.drawText(hole.x, hole.groundZ + 1.5 * h, h, 0, hole.name, 'center');
    for (const c of hole.contacts) {
      const z = hole.groundZ - c.depth;
      const tick = c.rockTop ? 2 * h : h;
      d.drawLine(hole.x - tick, z, hole.x + tick, z);
      d.drawText(hole.x + 1.5 * tick, z, 0.8 * h, 0, `${c.material} ${c.depth} m${c.rockTop ? ' (top of rock)' : ''}`, 'left', 'middle');
    }
  }

  d.setActiveLayer(L.stations);
  for (const s of section.stations) {
    d.drawPolyline([[s.x - 0.5 * h, s.z + h], [s.x + 0.5 * h, s.z + h], [s.x, s.z]], true);
    d.drawText(s.x, s.z + 1.3 * h, 0.7 * h, 90, String(s.station), 'left', 'middle');
  }
  d.setActiveLayer(L.shots);
  for (const s of section.shots) {
    d.drawCircle(s.x, s.z, 0.5 * h);
    d.drawText(s.x, s.z - 1.5 * h, 0.8 * h, 0, s.id, 'center', 'top');
  }

  // Title block under the section, left-aligned at the section's start.
  const t = section.title;
  const rows = [
    `${t.project} - line ${t.line}`,
    `${t.what}, exported ${t.date}`,
    `Chainage and elevation in metres, true scale (vertical exaggeration 1:1)${t.crs ? `; plan coordinates in ${t.crs}` : ''}`,
    ...notes,
    INTERPRETATION_CAUTION,
  ];
  d.setActiveLayer(L.title);
  const top = zBottom - 3 * h;
  rows.forEach((r, i) => d.drawText(xMin, top - i * 1.8 * h, i === 0 ? 1.4 * h : h, 0, r));
  d.drawRect(xMin - h, top + 2 * h, xMax + h, top - rows.length * 1.8 * h - h);
  return d.toDxfString();
}
