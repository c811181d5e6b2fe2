import { memo, useMemo } from 'react';
import type { LayerResult } from '../../../shared/layers';
import type { BoreholeView } from '../../../shared/schemas/boreholes';
import { LazyPlot } from '../plot/LazyPlot';
import { axisStyle } from '../line/plot/chartTheme';
import { LAYER_CHART_CONFIG, LAYER_CHART_LAYOUT } from './chartLayout';
import { LAYER_COLOURS } from './layerColours';
import { layerBands } from './layerBands';

/**
 * The depth section at true scale (1:1): each layer filled in its velocity's colour on the project's
 * scale (as every velocity section), the ground under the geophones and each refractor at its
 * interpreted elevation, one point per geophone, shots marked on the ground, boreholes and trial pits
 * as columns from their ground with a mark at each logged contact.
 */
export const DepthSection = memo(function DepthSection({
  result,
  ground,
  shots,
  holes,
  colourRange,
}: {
  result: LayerResult;
  ground: { x: number[]; z: number[] };
  shots: { x: number; z: number; id: string }[];
  holes: readonly BoreholeView[];
  colourRange: { min: number; max: number };
}) {
  const data = useMemo(() => {
    const refractors = [...new Set(result.depths.map((d) => d.refractor))].sort((a, b) => a - b);
    const deepest = Math.min(...result.depths.map((d) => d.refractorZ), ...ground.z);
    const relief = Math.max(...ground.z) - deepest;
    const bands = layerBands(result, ground, deepest - Math.max(3, 0.25 * relief), colourRange);
    return [
      ...bands.map((b) => ({
        type: 'scatter',
        mode: 'lines',
        fill: 'toself',
        fillcolor: b.colour,
        line: { width: 0 },
        name: `Layer ${b.layer + 1}, ${Math.round(b.velocity)} m/s`,
        legendgroup: 'bands',
        x: b.x,
        y: b.z,
        hoverinfo: 'name',
      })),
      { type: 'scatter', mode: 'lines', name: 'Ground', x: ground.x, y: ground.z, line: { color: '#57534e', width: 2 }, hovertemplate: 'ground at %{x:.2f} m: %{y:.2f} m<extra></extra>' },
      ...refractors.map((n) => {
        const pts = result.depths.filter((d) => d.refractor === n).sort((a, b) => a.x - b.x);
        return {
          type: 'scatter',
          mode: 'lines+markers',
          name: `Refractor ${n} (${Math.round(result.velocities[n])} m/s)`,
          x: pts.map((d) => d.x),
          y: pts.map((d) => d.refractorZ),
          customdata: pts.map((d) => d.depth),
          marker: { size: 6, color: LAYER_COLOURS[n] },
          line: { color: LAYER_COLOURS[n], width: 2 },
          hovertemplate: `refractor ${n} at %{x:.2f} m: elevation %{y:.2f} m, depth %{customdata:.2f} m<extra></extra>`,
        };
      }),
      {
        type: 'scatter',
        mode: 'markers',
        name: 'Shots',
        x: shots.map((s) => s.x),
        y: shots.map((s) => s.z),
        text: shots.map((s) => s.id),
        marker: { symbol: 'star', size: 11, color: '#292524' },
        hovertemplate: 'shot %{text} at %{x:.2f} m<extra></extra>',
      },
      ...holes.filter((h) => h.groundZResolved !== null).map((h) => {
        const top = h.groundZResolved!;
        return {
          type: 'scatter',
          mode: 'lines+markers',
          name: h.name,
          showlegend: false,
          x: [h.x, ...h.contacts.map(() => h.x)],
          y: [top, ...h.contacts.map((c) => top - c.depth)],
          text: [`${h.kind === 'trial_pit' ? 'trial pit' : 'borehole'} at the ground`, ...h.contacts.map((c) => `${c.material} at ${c.depth} m`)],
          line: { color: '#1c1917', width: 3 },
          marker: { symbol: 'line-ew-open', size: 12, color: '#1c1917' },
          hovertemplate: `${h.name.replace(/%/g, '%%')}: %{text}<extra></extra>`,
        };
      }),
    ];
  }, [result, ground, shots, holes, colourRange]);
  const layout = useMemo(
    () => ({
      ...LAYER_CHART_LAYOUT,
      xaxis: { ...axisStyle, title: { text: 'x along the line (m)' } },
      yaxis: { ...axisStyle, title: { text: 'elevation (m)' }, scaleanchor: 'x', scaleratio: 1 },
    }),
    [],
  );
  return <LazyPlot height={380} data={data} layout={layout} config={LAYER_CHART_CONFIG} />;
});
