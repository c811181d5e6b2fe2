import { memo, useMemo } from 'react';
import { LazyPlot } from '../plot/LazyPlot';
import { plainText } from '../plot/plainText';
import { axisStyle, CHART_FONT, shotColour } from '../line/plot/chartTheme';

export interface PickCurve {
  shotId: string;
  sourceX: number | null;
  points: { x: number; timeMs: number }[];
  current: boolean;
}

const CONFIG = { displaylogo: false, responsive: true, modeBarButtonsToRemove: ['lasso2d', 'autoScale2d', 'select2d'] };

/**
 * Travel-time curves of the picks made so far, one per record, redrawn as picks change; the record
 * in view is drawn heavier. Only records whose traces are placed on the line appear.
 */
export const PickCurves = memo(function PickCurves({ curves }: { curves: PickCurve[] }) {
  const data = useMemo(
    () =>
      curves.flatMap((c, i) => {
        const colour = shotColour(i);
        const line = {
          type: 'scatter',
          mode: 'lines+markers',
          name: plainText(`shot ${c.shotId}`),
          x: c.points.map((p) => p.x),
          y: c.points.map((p) => p.timeMs),
          line: { color: colour, width: c.current ? 3 : 1.5 },
          marker: { color: colour, size: c.current ? 7 : 4 },
          hovertemplate: 'x %{x} m<br>%{y:.2f} ms<extra></extra>',
        };
        const shot =
          c.sourceX === null
            ? []
            : [{ type: 'scatter', mode: 'markers', showlegend: false, x: [c.sourceX], y: [0], marker: { symbol: 'star', size: c.current ? 14 : 10, color: colour }, hovertemplate: `shot ${plainText(c.shotId)} at %{x} m<extra></extra>` }];
        return [line, ...shot];
      }),
    [curves],
  );
  const layout = useMemo(
    () => ({
      font: CHART_FONT,
      uirevision: 'picking',
      margin: { l: 56, r: 12, t: 12, b: 48 },
      paper_bgcolor: 'white',
      plot_bgcolor: 'white',
      hovermode: 'closest',
      showlegend: false,
      xaxis: { ...axisStyle, title: { text: 'receiver x (m)' } },
      yaxis: { ...axisStyle, title: { text: 'time (ms)' }, rangemode: 'tozero' },
    }),
    [],
  );
  return <LazyPlot height={340} data={data} layout={layout} config={CONFIG} />;
});
