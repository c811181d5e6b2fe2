import type { Station } from '../../../api/types';
import { axisStyle, CHART_FONT } from '../plot/chartTheme';
import { LazyPlot } from '../../plot/LazyPlot';

/** The ground surface the stations describe: elevation against chainage, one marker per station. */
export function ElevationProfile({ stations }: { stations: Station[] }) {
  return (
    <figure data-testid="elevation-profile" className="rounded-lg border border-stone-200 bg-white p-2">
      <LazyPlot
        height={240}
        data={[
          {
            type: 'scatter',
            mode: 'lines+markers',
            x: stations.map((s) => s.x),
            y: stations.map((s) => s.z),
            customdata: stations.map((s) => s.station),
            hovertemplate: 'station %{customdata}<br>x %{x} m<br>z %{y} m<extra></extra>',
            line: { color: '#57534e', width: 2 },
            marker: { color: '#1f5d57', size: 6 },
          },
        ]}
        layout={{
          font: CHART_FONT,
          margin: { l: 60, r: 20, t: 10, b: 50 },
          paper_bgcolor: 'white',
          plot_bgcolor: 'white',
          showlegend: false,
          xaxis: { ...axisStyle, title: { text: 'x along the line (m)' } },
          yaxis: { ...axisStyle, title: { text: 'elevation z (m)' } },
        }}
        config={{ displaylogo: false, responsive: true, modeBarButtonsToRemove: ['select2d', 'lasso2d'] }}
      />
      <figcaption className="px-2 pb-1 text-sm text-stone-600">
        Ground profile from the station table (vertical scale exaggerated). New velocity models of this line start from this surface.
      </figcaption>
    </figure>
  );
}
