import { LazyPlot, preloadCharts, type PlotProps } from '../../plot/LazyPlot';

/** The run pages load the chart library ahead, while the browser is idle. */
export const preloadRunCharts = preloadCharts;

export type RunPlotProps = PlotProps;

/** A lazily loaded plotly chart with an accessible name for the figure. */
export function RunPlot({ height, label, ...props }: RunPlotProps & { height: number; label: string }) {
  return (
    <div role="img" aria-label={label}>
      <LazyPlot height={height} {...props} />
    </div>
  );
}
