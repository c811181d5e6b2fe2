import { useMemo } from 'react';
import type { InversionIterationView } from '../../../shared/schemas/inversions';
import { RunPlot } from '../run/plot/RunPlot';
import { RUN_CHART_CONFIG, RUN_CHART_FONT, runAxis } from '../run/plot/runChartTheme';
import { CHI2_BAND, CHI2_TARGET, convergenceSeries, convergenceWords } from './convergenceTraces';

const CHI2_COLOUR = '#0072b2';
const RMS_COLOUR = '#d55e00';
/** Round ticks for a logarithmic χ² axis (1–2–5 series). */
const LOG_TICKS = [0.1, 0.2, 0.5, 1, 2, 5, 10, 20, 50, 100, 200, 500, 1000, 2000, 5000];

/** χ² (left axis) and RMS misfit (right axis) per iteration, with the χ² = 1 target and its stopping band; live while the inversion runs. */
export function ConvergenceChart({ history, maxIterations }: { history: readonly InversionIterationView[]; maxIterations: number }) {
  const series = useMemo(() => convergenceSeries(history), [history]);
  const words = convergenceWords(series);
  const data = useMemo(
    () => [
      { x: series.iterations, y: series.chi2, name: 'χ² per datum', type: 'scatter' as const, mode: 'lines+markers' as const, line: { color: CHI2_COLOUR, width: 2.5 }, marker: { size: 8 }, hovertemplate: 'iteration %{x}: χ² %{y:.3f}<extra></extra>' },
      { x: series.iterations, y: series.rmsMs, name: 'RMS misfit (ms)', yaxis: 'y2', type: 'scatter' as const, mode: 'lines+markers' as const, line: { color: RMS_COLOUR, width: 2, dash: 'dot' as const }, marker: { size: 7, symbol: 'square' as const }, hovertemplate: 'iteration %{x}: RMS %{y:.3f} ms<extra></extra>' },
    ],
    [series],
  );
  const log = series.chi2Log;
  const layout = useMemo(
    () => ({
      font: RUN_CHART_FONT,
      margin: { l: 64, r: 64, t: 40, b: 48 },
      paper_bgcolor: '#ffffff',
      plot_bgcolor: '#ffffff',
      showlegend: true,
      legend: { orientation: 'h' as const, x: 0, y: 1, yanchor: 'bottom' as const },
      xaxis: { ...runAxis, title: { text: 'iteration (0 = starting model)' }, range: [-0.3, Math.max(maxIterations, series.iterations.at(-1) ?? 0) + 0.3], tick0: 0, dtick: maxIterations <= 10 ? 1 : maxIterations <= 25 ? 2 : 5 },
      yaxis: log
        ? { ...runAxis, title: { text: 'χ² per datum' }, type: 'log' as const, tickmode: 'array' as const, tickvals: LOG_TICKS, ticktext: LOG_TICKS.map(String) }
        : { ...runAxis, title: { text: 'χ² per datum' }, type: 'linear' as const, rangemode: 'tozero' as const },
      // Its own ticks: an overlaid axis would otherwise copy the χ² axis's tick positions.
      yaxis2: { ...runAxis, title: { text: 'RMS misfit (ms)' }, overlaying: 'y' as const, side: 'right' as const, showgrid: false, rangemode: 'tozero' as const, tickmode: 'auto' as const, nticks: 6 },
      shapes: [
        { type: 'rect' as const, xref: 'paper' as const, x0: 0, x1: 1, yref: 'y' as const, y0: CHI2_BAND[0], y1: CHI2_BAND[1], fillcolor: 'rgba(5, 150, 105, 0.12)', line: { width: 0 }, layer: 'below' as const },
        { type: 'line' as const, xref: 'paper' as const, x0: 0, x1: 1, yref: 'y' as const, y0: CHI2_TARGET, y1: CHI2_TARGET, line: { color: '#047857', width: 1.5, dash: 'dash' as const } },
      ],
      annotations: [{ xref: 'paper' as const, x: 1, xanchor: 'right' as const, yref: 'y' as const, y: log ? Math.log10(CHI2_TARGET) : CHI2_TARGET, yanchor: 'bottom' as const, text: 'target χ² = 1', showarrow: false, font: { color: '#047857', size: 13 } }],
    }),
    [log, maxIterations, series.iterations],
  );
  return (
    <figure data-testid="convergence-chart" data-points={series.iterations.length}>
      <RunPlot height={300} label={`Convergence: ${words}`} data={data} layout={layout} config={RUN_CHART_CONFIG} />
      <figcaption className="mt-1 text-sm text-stone-700" aria-live="polite" data-testid="convergence-words">
        {words}
      </figcaption>
    </figure>
  );
}
