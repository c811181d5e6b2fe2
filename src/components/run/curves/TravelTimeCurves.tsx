import { memo, useMemo } from 'react';
import type { Layout, PlotMouseEvent } from 'plotly.js';
import type { ResidualRow } from '../../../api/types';
import { RunPlot } from '../plot/RunPlot';
import { RUN_CHART_CONFIG, RUN_CHART_FONT, runAxis } from '../plot/runChartTheme';
import { curveTraces } from './curveTraces';

/**
 * Observed picks (points, ±σ) against computed travel times (lines) for every shot, with the
 * residuals in a second panel below on the same x axis. Clicking a point opens that pick.
 * Memoised: nothing else on the page should make plotly redraw thousands of points.
 */
export const TravelTimeCurves = memo(function TravelTimeCurves({ runId, rows, onPick }: { runId: string; rows: ResidualRow[]; onPick: (pickIndex: number) => void }) {
  const data = useMemo(() => curveTraces(rows), [rows]);
  const shots = new Set(rows.map((r) => r.shotId)).size;
  const layout = useMemo<Partial<Layout>>(
    () => ({
      font: RUN_CHART_FONT,
      uirevision: runId,
      margin: { l: 70, r: 16, t: 16, b: 56 },
      paper_bgcolor: 'white',
      plot_bgcolor: 'white',
      hovermode: 'closest',
      showlegend: true,
      legend: shots <= 14 ? { orientation: 'h', yanchor: 'top', y: -0.1, font: { size: 13 } } : { orientation: 'v', x: 1.01, y: 1, font: { size: 12 } },
      xaxis: { ...runAxis, title: { text: 'receiver x along the line (m)' }, anchor: 'y2' },
      yaxis: { ...runAxis, title: { text: 'first arrival (ms)' }, domain: [0.36, 1], rangemode: 'tozero' },
      yaxis2: { ...runAxis, title: { text: 'residual (ms)' }, domain: [0, 0.28], zeroline: true, zerolinewidth: 1.5 },
    }),
    [runId, shots],
  );
  return (
    <figure>
      <RunPlot
        height={680}
        label="Travel-time curves: observed picks and computed times for every shot, residuals below"
        data={data}
        layout={layout}
        config={RUN_CHART_CONFIG}
        onClick={(e: Readonly<PlotMouseEvent>) => {
          const index = e.points[0]?.customdata;
          if (typeof index === 'number') onPick(index);
        }}
      />
      <figcaption data-testid="curves-key" className="mt-2 max-w-prose text-sm text-stone-700">
        Dots: first arrivals picked in the field, one colour per shot (grey crosses: excluded from the misfit). Lines: times computed on the
        model. Vertical bars: ±σ, the pick's uncertainty. Lower panel: residual, observed minus computed; a dot above zero arrived later in the
        field than in the model. Click a dot for that pick's details and ray.
      </figcaption>
    </figure>
  );
});
