import { CHART_FONT } from '../line/plot/chartTheme';

/** What the layer-method charts share: the page's font, white ground, legend above, closest-point hover. */
export const LAYER_CHART_LAYOUT = {
  font: CHART_FONT,
  margin: { l: 64, r: 16, t: 24, b: 56 },
  paper_bgcolor: 'white',
  plot_bgcolor: 'white',
  hovermode: 'closest',
  legend: { orientation: 'h', xanchor: 'left', x: 0, yanchor: 'bottom', y: 1.02 },
} as const;

/** Fixed, so plotly never sees a "changed" config and redraws for nothing. */
export const LAYER_CHART_CONFIG = { displaylogo: false, responsive: true, modeBarButtonsToRemove: ['lasso2d', 'select2d', 'autoScale2d'] };
