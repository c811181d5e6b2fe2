/**
 * The run pages' one door to plotly (~5 MB). Import it only through RunPlot, so the library
 * arrives in its own chunk the first time a chart is shown.
 */
import createPlotlyComponent from 'react-plotly.js/factory';
import Plotly from 'plotly.js-dist-min';

const RunPlotlyChart = createPlotlyComponent(Plotly);
export default RunPlotlyChart;
