import { memo, useMemo } from 'react';
import { axisStyle, CHART_FONT } from '../plot/chartTheme';
import { LazyPlot } from '../../plot/LazyPlot';
import { chartTraces, fitAnnotations, type ChartInput } from './chartTraces';

export interface TravelTimeChartProps extends ChartInput {
  revisionKey: string;
  dragMode: 'zoom' | 'select';
  onToggleTrace: (name: string) => void;
  onRange: (xFrom: number, xTo: number) => void;
  onPickClick: (index: number) => void;
}

/** Fixed, so plotly never sees a "changed" config and redraws for nothing. */
const CONFIG = { displaylogo: false, responsive: true, modeBarButtonsToRemove: ['lasso2d', 'autoScale2d'] };

/** A legend row above the plot for a few shots (clear of the axis title); with many, a scrolling column at the side. */
const legendFor = (shots: number) =>
  shots <= 14 ? { orientation: 'h', xanchor: 'left', x: 0, yanchor: 'bottom', y: 1.02, font: { size: 13 } } : { orientation: 'v', x: 1.01, y: 1, font: { size: 12 } };

/**
 * Travel-time curves of every shot on one chart, with the QC marks and kept velocity fits over
 * them. Memoised: typing elsewhere on the page must not make plotly redraw thousands of points.
 */
export const TravelTimeChart = memo(function TravelTimeChart(props: TravelTimeChartProps) {
  const { curves, picksByIndex, excluded, hidden, flags, pairs, fits, selected, revisionKey, dragMode } = props;
  const data = useMemo(
    () => chartTraces({ curves, picksByIndex, excluded, hidden, flags, pairs, fits, selected }),
    [curves, picksByIndex, excluded, hidden, flags, pairs, fits, selected],
  );
  const layout = useMemo(
    () => ({
      font: CHART_FONT,
      uirevision: revisionKey,
      margin: { l: 64, r: 16, t: 24, b: 56 },
      paper_bgcolor: 'white',
      plot_bgcolor: 'white',
      dragmode: dragMode,
      selectdirection: 'h',
      hovermode: 'closest',
      legend: legendFor(curves.length),
      xaxis: { ...axisStyle, title: { text: 'receiver x (m)' } },
      yaxis: { ...axisStyle, title: { text: 'time (ms)' }, rangemode: 'tozero' },
      yaxis2: { overlaying: 'y', range: [0, 1], visible: false, fixedrange: true },
      annotations: fitAnnotations(fits),
    }),
    [revisionKey, dragMode, curves.length, fits],
  );

  return (
    <LazyPlot
      height={curves.length <= 14 ? 480 : 560}
      data={data}
      layout={layout}
      config={CONFIG}
      onLegendClick={(e: { curveNumber: number; data: { meta?: unknown }[] }) => {
        // `meta` holds the raw shot id or overlay name; the drawn name is escaped (plainText).
        const name = e.data[e.curveNumber]?.meta;
        if (typeof name !== 'string') return false;
        props.onToggleTrace(name);
        return false; // visibility is ours, so it survives re-renders
      }}
      onLegendDoubleClick={() => false}
      onSelected={(e: { range?: { x?: [number, number] } } | undefined) => {
        const r = e?.range?.x;
        if (r && Number.isFinite(r[0]) && Number.isFinite(r[1])) props.onRange(Math.min(r[0], r[1]), Math.max(r[0], r[1]));
      }}
      onClick={(e: { points?: { customdata?: unknown; data?: { yaxis?: string } }[] }) => {
        const pt = e.points?.[0];
        if (pt && typeof pt.customdata === 'number' && pt.data?.yaxis !== 'y2') props.onPickClick(pt.customdata);
      }}
    />
  );
});
