import { Component, lazy, Suspense, type ComponentProps, type ReactNode } from 'react';

const PlotlyChart = lazy(() => import('./PlotlyChart'));

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
          The chart could not be drawn. Reload the page to try again; the tables below still hold every number.
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
