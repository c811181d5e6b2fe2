import type { Data } from 'plotly.js';
import type { Grid } from '../../../../shared/grid';
import { msToS } from '../../../../shared/units';
import { isolineSegments, labelPoint } from './isolines';
import type { RayPath, Station } from '../../../api/types';
import type { ContourLevels } from './contourLevels';
import { gridAxes, gridRows, joinPolylines } from './sectionData';

interface GridValues {
  grid: Grid;
  values: Float32Array;
}

export interface SectionGeometry {
  surface: [number, number][] | null;
  layerBases: { name: string; base: [number, number][] }[];
  stations: Station[];
  shots: { shotId: string; x: number; z: number }[];
  selectedShot: string | null;
}

const RAY_COLOUR = '#9f1239';
/**
 * Slow ground pale sand, fast ground mid blue: lightness falls steadily with velocity and never gets
 * dark, so black wavefronts, red rays and station marks stay readable on every layer.
 */
const VELOCITY_SCALE: [number, string][] = [
  [0, '#f6e7c8'],
  [0.3, '#dfe8c9'],
  [0.6, '#b5d6d6'],
  [1, '#7fa9c9'],
];
const WAVEFRONT_COLOUR = '#1c1917';

/*
 * The section is drawn as velocity heatmap, then wavefronts, rays, interfaces, stations and shots on top.
 * Each group is built by its own function, so the page can memoise them apart: plotly then redraws only
 * the traces whose arrays changed (it compares them by reference), not the 50 000-cell heatmap on every shot.
 */

export function velocityTrace(velocity: GridValues): Data {
  const { xs, zs } = gridAxes(velocity.grid);
  return {
      type: 'heatmap',
      name: 'Velocity',
      x: xs,
      y: zs,
      z: gridRows(velocity.values, velocity.grid),
      colorscale: VELOCITY_SCALE,
      colorbar: { title: { text: 'v (m/s)', side: 'right' }, thickness: 14, len: 0.9 },
      hovertemplate: 'x %{x:.1f} m, elevation %{y:.1f} m<br>v %{z:.0f} m/s<extra></extra>',
      showlegend: false,
    } as Data;
}

/**
 * The shot's first-arrival wavefronts: every contour level in one line trace (segments split by null),
 * and their labels (ms) as text on small pale tiles so they read over any velocity colour.
 */
export function wavefrontTraces(field: GridValues, source: { x: number; z: number } | null, levels: ContourLevels): Data[] {
  const x: (number | null)[] = [];
  const y: (number | null)[] = [];
  const labels: { x: number; z: number; text: string }[] = [];
  const { grid } = field;
  const left = grid.x0;
  const right = grid.x0 + (grid.nx - 1) * grid.dx;
  const from = source ?? { x: left, z: grid.z0 };
  // Labels run towards the far end of the line from the shot, where there is room for them.
  const towardsX = from.x - left < right - from.x ? right : left;
  for (let k = 0; k < levels.count; k++) {
    const levelMs = round9(levels.start + k * levels.size);
    const segments = isolineSegments(field.values, grid, msToS(levelMs));
    for (let i = 0; i + 3 < segments.length; i += 4) x.push(segments[i]!, segments[i + 2]!, null), y.push(segments[i + 1]!, segments[i + 3]!, null);
    const at = labelPoint(segments, from, towardsX);
    if (at) labels.push({ ...at, text: String(levelMs) });
  }
  return [
    {
      type: 'scatter',
      mode: 'lines',
      name: `Wavefronts every ${levels.size} ms`,
      x,
      y,
      line: { color: WAVEFRONT_COLOUR, width: 1 },
      hoverinfo: 'skip',
    },
    {
      type: 'scatter',
      mode: 'text+markers',
      name: 'Wavefront labels (ms)',
      showlegend: false,
      x: labels.map((l) => l.x),
      y: labels.map((l) => l.z),
      text: labels.map((l) => l.text),
      textposition: 'middle center',
      textfont: { size: 11, color: WAVEFRONT_COLOUR },
      marker: { symbol: 'square', size: labels.map((l) => 8 + 6 * l.text.length), color: 'rgba(255,255,255,0.8)', line: { width: 0 } },
      hovertemplate: 'first arrival %{text} ms<extra></extra>',
    } as Data,
  ];
}

function round9(v: number): number {
  return Math.round(v * 1e9) / 1e9;
}

/** All rays of the shot in one trace, and the chosen pick's ray drawn heavier. */
export function rayTraces(rays: RayPath[], highlightPick: number | null): Data[] {
  const traces: Data[] = [];
  if (rays.length > 0) {
    const all = joinPolylines(rays.map((r) => r.points));
    traces.push({
      type: 'scatter',
      mode: 'lines',
      name: 'Rays to the receivers',
      x: all.x,
      y: all.y,
      line: { color: RAY_COLOUR, width: 1 },
      opacity: 0.75,
      hoverinfo: 'skip',
    });
    const hit = rays.find((r) => r.pickIndex === highlightPick);
    if (hit) {
      const one = joinPolylines([hit.points]);
      traces.push({ type: 'scatter', mode: 'lines', name: 'Ray of the chosen pick', x: one.x, y: one.y, line: { color: RAY_COLOUR, width: 3.5 }, hoverinfo: 'skip' });
    }
  }
  return traces;
}

/** Ground surface, layer bases, stations and shots (the chosen shot larger). */
export function geometryTraces(input: SectionGeometry): Data[] {
  const traces: Data[] = [];
  if (input.surface) {
    traces.push({
      type: 'scatter',
      mode: 'lines',
      name: 'Ground surface',
      x: input.surface.map((p) => p[0]),
      y: input.surface.map((p) => p[1]),
      line: { color: '#44403c', width: 1.5 },
      hoverinfo: 'skip',
    });
  }
  input.layerBases.forEach((layer, i) =>
    traces.push({
      type: 'scatter',
      mode: 'lines',
      name: 'Layer bases',
      legendgroup: 'bases',
      showlegend: i === 0,
      x: layer.base.map((p) => p[0]),
      y: layer.base.map((p) => p[1]),
      line: { color: '#57534e', width: 1.2, dash: 'dash' },
      hovertemplate: `base of ${escapeHover(layer.name)}<extra></extra>`,
    }),
  );

  if (input.stations.length > 0) {
    traces.push({
      type: 'scatter',
      mode: 'markers',
      name: 'Stations (geophones)',
      x: input.stations.map((s) => s.x),
      y: input.stations.map((s) => s.z),
      marker: { symbol: 'triangle-down', size: 7, color: '#292524' },
      hovertemplate: input.stations.map((s) => `station ${s.station}<br>x %{x:.2f} m, elevation %{y:.2f} m<extra></extra>`),
    } as Data);
  }
  if (input.shots.length > 0) {
    const selected = input.shots.map((s) => s.shotId === input.selectedShot);
    traces.push({
      type: 'scatter',
      mode: 'text+markers',
      name: 'Shots',
      x: input.shots.map((s) => s.x),
      y: input.shots.map((s) => s.z),
      text: input.shots.map((s) => s.shotId),
      textposition: 'top center',
      textfont: { size: 12, color: '#7c2d12' },
      marker: {
        symbol: 'star',
        size: selected.map((on) => (on ? 17 : 11)),
        color: selected.map((on) => (on ? '#ea580c' : '#fdba74')),
        line: { color: '#7c2d12', width: selected.map((on) => (on ? 1.5 : 0.8)) },
      },
      hovertemplate: 'shot %{text}<br>x %{x:.2f} m, elevation %{y:.2f} m<extra></extra>',
      cliponaxis: false,
    } as Data);
  }
  return traces;
}

/** Layer names come from a user's file; plotly renders hover text as HTML-ish markup. */
function escapeHover(text: string): string {
  return text.replace(/[<>&]/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;' })[c]!);
}
