import type { Data } from 'plotly.js';
import type { Grid } from '../../../../shared/grid';
import { sToMs } from '../../../../shared/units';
import type { RayPath, Station } from '../../../api/types';
import type { ContourLevels } from './contourLevels';
import { gridAxes, gridRows, joinPolylines } from './sectionData';

export interface SectionInput {
  velocity: { grid: Grid; values: Float32Array };
  /** The selected shot's travel times (s) on the same grid, or null while loading. */
  field: { grid: Grid; values: Float32Array } | null;
  levels: ContourLevels | null;
  rays: RayPath[];
  highlightPick: number | null;
  surface: [number, number][] | null;
  layerBases: { name: string; base: [number, number][] }[];
  stations: Station[];
  shots: { shotId: string; x: number; z: number }[];
  selectedShot: string | null;
}

const RAY_COLOUR = '#9f1239';
const WAVEFRONT_COLOUR = '#1c1917';

/** Velocity heatmap, then wavefronts, rays, interfaces, stations and shots on top, in that order. */
export function sectionTraces(input: SectionInput): Data[] {
  const { xs, zs } = gridAxes(input.velocity.grid);
  const traces: Data[] = [
    {
      type: 'heatmap',
      name: 'Velocity',
      x: xs,
      y: zs,
      z: gridRows(input.velocity.values, input.velocity.grid),
      colorscale: 'YlGnBu',
      colorbar: { title: { text: 'v (m/s)', side: 'right' }, thickness: 14, len: 0.9 },
      hovertemplate: 'x %{x:.1f} m, elevation %{y:.1f} m<br>v %{z:.0f} m/s<extra></extra>',
      showlegend: false,
    } as Data,
  ];

  if (input.field && input.levels) {
    const f = gridAxes(input.field.grid);
    traces.push({
      type: 'contour',
      name: 'Wavefronts (ms)',
      x: f.xs,
      y: f.zs,
      z: gridRows(input.field.values, input.field.grid, sToMs(1)),
      autocontour: false,
      contours: {
        coloring: 'lines',
        showlabels: true,
        labelfont: { size: 11, color: WAVEFRONT_COLOUR },
        start: input.levels.start,
        end: input.levels.end,
        size: input.levels.size,
      },
      colorscale: [
        [0, WAVEFRONT_COLOUR],
        [1, WAVEFRONT_COLOUR],
      ],
      line: { width: 1, smoothing: 0.6 },
      showscale: false,
      showlegend: true,
      hovertemplate: 'first arrival %{z:.1f} ms<extra></extra>',
    } as Data);
  }

  if (input.rays.length > 0) {
    const all = joinPolylines(input.rays.map((r) => r.points));
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
    const hit = input.rays.find((r) => r.pickIndex === input.highlightPick);
    if (hit) {
      const one = joinPolylines([hit.points]);
      traces.push({ type: 'scatter', mode: 'lines', name: 'Ray of the chosen pick', x: one.x, y: one.y, line: { color: RAY_COLOUR, width: 3.5 }, hoverinfo: 'skip' });
    }
  }

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
