import { memo, useMemo } from 'react';
import type { Assignment } from '../../../shared/layers';
import { sToMs } from '../../../shared/units';
import { LazyPlot } from '../plot/LazyPlot';
import { axisStyle } from '../line/plot/chartTheme';
import { LAYER_CHART_CONFIG, LAYER_CHART_LAYOUT } from './chartLayout';
import { layerColour, layerName } from './layerColours';
import type { PlacedLine } from './layerInterpretation';

/**
 * Every shot's travel-time curve, each pick coloured by the layer it is assigned to (direct wave,
 * refractor 1, 2, or left out). Clicking a pick hands it to the caller, which applies the chosen
 * layer. One trace per layer so the legend reads as the colour key.
 */
export const AssignmentChart = memo(function AssignmentChart({ line, assignment, layers, onPick }: { line: PlacedLine; assignment: Assignment; layers: number; onPick: (index: number) => void }) {
  const data = useMemo(() => {
    const lines = line.placed.map((shot) => ({
      type: 'scatter',
      mode: 'lines',
      x: shot.picks.map((_, i) => shot.receivers[2 * i]),
      y: shot.picks.map((p) => sToMs(p.time)),
      line: { color: '#d6d3d1', width: 1 },
      hoverinfo: 'skip',
      showlegend: false,
    }));
    const byLayer = new Map<number, { x: number[]; y: number[]; ids: number[]; text: string[] }>();
    line.placed.forEach((shot, s) =>
      shot.picks.forEach((p, i) => {
        const layer = assignment[s][i];
        const bucket = byLayer.get(layer) ?? { x: [], y: [], ids: [], text: [] };
        bucket.x.push(shot.receivers[2 * i]);
        bucket.y.push(sToMs(p.time));
        bucket.ids.push(line.indices[s][i]);
        bucket.text.push(`shot ${shot.shotId}`);
        byLayer.set(layer, bucket);
      }),
    );
    const points = [-1, ...Array.from({ length: layers }, (_, k) => k)]
      .filter((k) => byLayer.has(k))
      .map((k) => {
        const b = byLayer.get(k)!;
        return {
          type: 'scatter',
          mode: 'markers',
          name: layerName(k),
          x: b.x,
          y: b.y,
          customdata: b.ids,
          text: b.text,
          hovertemplate: '%{text}<br>x %{x:.2f} m, %{y:.2f} ms<extra>%{fullData.name}</extra>',
          marker: { color: layerColour(k), size: 7, symbol: k < 0 ? 'x' : 'circle' },
        };
      });
    const sources = {
      type: 'scatter',
      mode: 'markers',
      name: 'Shots',
      x: line.placed.map((s) => s.source.x),
      y: line.placed.map(() => 0),
      text: line.placed.map((s) => s.shotId),
      hovertemplate: 'shot %{text} at %{x:.2f} m<extra></extra>',
      marker: { symbol: 'star', size: 11, color: '#292524' },
    };
    return [...lines, ...points, sources];
  }, [line, assignment, layers]);
  const layout = useMemo(
    () => ({
      ...LAYER_CHART_LAYOUT,
      uirevision: 'assignment',
      xaxis: { ...axisStyle, title: { text: 'x along the line (m)' } },
      yaxis: { ...axisStyle, title: { text: 'first-arrival time (ms)' }, rangemode: 'tozero' },
    }),
    [],
  );
  return (
    <LazyPlot
      height={460}
      data={data}
      layout={layout}
      config={LAYER_CHART_CONFIG}
      onClick={(e: { points?: { customdata?: unknown }[] }) => {
        const id = e.points?.[0]?.customdata;
        if (typeof id === 'number' && id >= 0) onPick(id);
      }}
    />
  );
});
