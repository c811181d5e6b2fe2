import { Component, lazy, Suspense, type ComponentProps, type ReactNode } from 'react';

const loadChart = () => import('./PlotlyChart');
const PlotlyChart = lazy(loadChart);

/**
 * Fetch and evaluate the chart library while the browser is idle, so the first chart opens
 * without the multi-second wait for ~5 MB of script. Safe to call more than once.
 */
export function preloadCharts(): void {
  const start = () => void loadChart().catch(() => undefined); // a failure shows later, in ChartBoundary
  if ('requestIdleCallback' in window) window.requestIdleCallback(start, { timeout: 5000 });
  else setTimeout(start, 2000);
}

export type PlotProps = ComponentProps<typeof PlotlyChart>;

/** If the chart library fails to load (offline, stale deployment), say so instead of a blank page. */
class ChartBoundary extends Component<{ children: ReactNode }, { failed: boolean }> {
  state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  render() {
    if (this.state.failed)
      return (
        <p role="alert" className="rounded-md border border-amber-300 bg-amber-50 px-4 py-3 text-amber-900">
          The chart could not be drawn. Reload the page to try again; the tables still hold every number.
        </p>
      );
    return this.props.children;
  }
}

/** A plotly chart that loads the library on first use and shows a calm placeholder meanwhile. */
export function LazyPlot({ height, ...props }: PlotProps & { height: number }) {
  return (
    <ChartBoundary>
      <Suspense
        fallback={
          <div role="status" style={{ height }} className="flex items-center justify-center rounded-lg border border-stone-200 bg-white text-stone-600">
            Loading the chart…
          </div>
        }
      >
        <PlotlyChart useResizeHandler style={{ width: '100%', height }} {...props} />
      </Suspense>
    </ChartBoundary>
  );
}
