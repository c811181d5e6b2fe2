/** Shared look for the line charts: the page's stone greys and quiet gridlines. */
export const CHART_FONT = { family: '"Source Sans 3", ui-sans-serif, system-ui, sans-serif', size: 14, color: '#292524' };

export const axisStyle = {
  gridcolor: '#e7e5e4',
  zerolinecolor: '#d6d3d1',
  linecolor: '#a8a29e',
  ticks: 'outside' as const,
  tickcolor: '#a8a29e',
  automargin: true,
};

/** Distinct, colour-blind-friendly hues for shots (Okabe–Ito order, then darker variants). */
export const SHOT_COLOURS = ['#0072b2', '#d55e00', '#009e73', '#cc79a7', '#e69f00', '#56b4e9', '#7a5c00', '#5d3a9b', '#1b7837', '#b2182b', '#2166ac', '#8c510a'];

export const shotColour = (i: number) => SHOT_COLOURS[i % SHOT_COLOURS.length];
