/**
 * The one place that loads plotly (~5 MB). Import it only through LazyPlot, so the
 * library arrives in its own chunk when a chart is first shown.
 */
import createPlotlyComponent from 'react-plotly.js/factory';
import Plotly from 'plotly.js-dist-min';

const PlotlyChart = createPlotlyComponent(Plotly);
export default PlotlyChart;
