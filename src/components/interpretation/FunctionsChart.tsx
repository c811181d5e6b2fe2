import { memo, useMemo } from 'react';
import type { LayerResult } from '../../../shared/layers';
import { sToMs } from '../../../shared/units';
import { LazyPlot } from '../plot/LazyPlot';
import { axisStyle, shotColour } from '../line/plot/chartTheme';
import { LAYER_CHART_CONFIG, LAYER_CHART_LAYOUT } from './chartLayout';

/**
 * The checks of a delay-time interpretation, per reversed shot pair: the velocity-analysis function
 * (top; straight with slope 1/V where the refractor velocity is uniform; at XY = 0 it is the
 * plus–minus T⁻/2 + t_AB) and the time-depth under each geophone (bottom; T⁺/2 at XY = 0).
 * Pairs that disagree point at a wrong assignment or a bad pick.
 */
export const FunctionsChart = memo(function FunctionsChart({ result, refractor }: { result: LayerResult; refractor: number }) {
  const f = result.functions.find((r) => r.refractor === refractor);
  const data = useMemo(() => {
    if (!f) return [];
    return f.pairs.flatMap((p, k) => {
      const name = `${p.forwardShot} – ${p.reverseShot}`;
      const common = { type: 'scatter', mode: 'lines+markers', name, legendgroup: name, marker: { size: 5, color: shotColour(k) }, line: { color: shotColour(k), width: 1.5 } };
      return [
        { ...common, x: p.x, y: p.velocityFn.map(sToMs), yaxis: 'y', hovertemplate: `${name}<br>x %{x:.2f} m, t<sub>V</sub> %{y:.2f} ms<extra></extra>` },
        { ...common, x: p.x, y: p.timeDepth.map(sToMs), yaxis: 'y2', showlegend: false, hovertemplate: `${name}<br>x %{x:.2f} m, time-depth %{y:.2f} ms<extra></extra>` },
      ];
    });
  }, [f]);
  const layout = useMemo(
    () => ({
      ...LAYER_CHART_LAYOUT,
      grid: { rows: 2, columns: 1, roworder: 'top to bottom' },
      xaxis: { ...axisStyle, title: { text: 'x along the line (m)' } },
      yaxis: { ...axisStyle, title: { text: 'velocity analysis (ms)' }, domain: [0.55, 1] },
      yaxis2: { ...axisStyle, title: { text: 'time-depth (ms)' }, domain: [0, 0.45] },
    }),
    [],
  );
  if (!f || !f.pairs.length) return <p className="text-stone-600">No reversed pair to draw for refractor {refractor}.</p>;
  return <LazyPlot height={520} data={data} layout={layout} config={LAYER_CHART_CONFIG} />;
});
