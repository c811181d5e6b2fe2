/** The run charts' look: the page's stone greys and font, quiet gridlines, no plotly logo. */
export const RUN_CHART_FONT = { family: '"Source Sans 3", ui-sans-serif, system-ui, sans-serif', size: 14, color: '#292524' };

export const RUN_CHART_CONFIG = { displaylogo: false, responsive: true, modeBarButtonsToRemove: ['lasso2d', 'select2d'] } as const;

export const runAxis = {
  gridcolor: '#e7e5e4',
  zerolinecolor: '#a8a29e',
  linecolor: '#a8a29e',
  ticks: 'outside' as const,
  tickcolor: '#a8a29e',
  automargin: true,
};

/**
 * Shot hues: the Okabe–Ito colour-blind-safe set (Okabe & Ito, "Color Universal Design", 2008),
 * then darker extras for lines with many shots. Same order as the line page's charts.
 */
const SHOT_COLOURS = ['#0072b2', '#d55e00', '#009e73', '#cc79a7', '#e69f00', '#56b4e9', '#7a5c00', '#5d3a9b', '#1b7837', '#b2182b', '#2166ac', '#8c510a'];

export const shotColour = (i: number): string => SHOT_COLOURS[i % SHOT_COLOURS.length]!;
