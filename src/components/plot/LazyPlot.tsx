import { Component, lazy, Suspense, useEffect, useRef, useState, type ComponentProps, type ReactNode } from 'react';

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

/**
 * A plotly chart that loads the library when the chart first comes near the screen (a page whose
 * charts are all further down never fetches the ~1 MB of compressed script), with a calm
 * placeholder of the chart's height meanwhile.
 */
export function LazyPlot({ height, ...props }: PlotProps & { height: number }) {
  const [near, setNear] = useState(() => typeof IntersectionObserver === 'undefined');
  const box = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = box.current;
    if (near || !el) return;
    const seen = new IntersectionObserver((entries) => entries.some((e) => e.isIntersecting) && setNear(true), { rootMargin: '400px 0px' });
    seen.observe(el);
    return () => seen.disconnect();
  }, [near]);
  const placeholder = (
    <div role="status" style={{ height }} className="flex items-center justify-center rounded-lg border border-stone-200 bg-white text-stone-600">
      Loading the chart…
    </div>
  );
  return (
    <div ref={box}>
      {near ? (
        <ChartBoundary>
          <Suspense fallback={placeholder}>
            <PlotlyChart useResizeHandler style={{ width: '100%', height }} {...props} />
          </Suspense>
        </ChartBoundary>
      ) : (
        placeholder
      )}
    </div>
  );
}
