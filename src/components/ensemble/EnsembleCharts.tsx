import { useMemo } from 'react';
import { finiteRange, VELOCITY_CSS_STOPS, type VelocityColourRange } from '../../../shared/colour/velocity-scale';
import type { EnsembleSectionView } from '../../../shared/schemas/ensembles';
import { rockWords } from '../../../shared/uncertainty/wording';
import { gridAxes, heatmapRows, toFloat32 } from '../inversion/sectionArrays';
import { RunPlot } from '../run/plot/RunPlot';
import { RUN_CHART_CONFIG, RUN_CHART_FONT, runAxis } from '../run/plot/runChartTheme';
import { bandShapes } from './bandTraces';

/** Spread: pale to deep slate (a light background reads as "little spread"). Ours; no source. */
const SPREAD_SCALE: [number, string][] = [[0, '#f5f5f4'], [0.5, '#a5b4c4'], [1, '#334155']];
/** Probability faster than v*: sand (slow ground likely) to slate blue (rock likely), grey-white at one half. */
const PROBABILITY_SCALE: [number, string][] = [[0, '#e9c48f'], [0.5, '#f5f5f4'], [1, '#4f6f95']];

function layout(title: string) {
  return {
    font: RUN_CHART_FONT,
    margin: { l: 56, r: 16, t: 36, b: 44 },
    title: { text: title, font: { size: 15 } },
    paper_bgcolor: '#ffffff',
    plot_bgcolor: '#e7e5e4',
    showlegend: false,
    xaxis: { ...runAxis, zeroline: false, title: { text: 'x along the line (m)' } },
    yaxis: { ...runAxis, zeroline: false, title: { text: 'elevation (m)' } },
  };
}

function ground(section: EnsembleSectionView) {
  const pts = section.surface ?? [[section.grid.x0, section.grid.z0], [section.grid.x0 + (section.grid.nx - 1) * section.grid.dx, section.grid.z0]];
  return { type: 'scatter' as const, mode: 'lines' as const, x: pts.map((p) => p[0]), y: pts.map((p) => p[1]), line: { color: '#44403c', width: 1.5 }, hoverinfo: 'skip' as const };
}

/** Mean velocity with the depth band of v* drawn over it (5–95 % filled, median dashed). */
export function MeanWithBand({ section, colours, height = 300 }: { section: EnsembleSectionView; colours: VelocityColourRange; height?: number }) {
  const { xs, zs } = useMemo(() => gridAxes(section.grid), [section.grid]);
  const data = useMemo(() => {
    const band = bandShapes(section.bands);
    return [
      {
        type: 'heatmap' as const, x: xs, y: zs, z: heatmapRows(section.mean, section.grid), zmin: colours.min, zmax: colours.max,
        colorscale: VELOCITY_CSS_STOPS.map(([t, c]) => [t, c]), colorbar: { title: { text: 'm/s' }, thickness: 12 },
        hovertemplate: 'x %{x} m, elevation %{y} m: mean %{z:.0f} m/s<extra></extra>', hoverongaps: false,
      },
      ground(section),
      ...band.outlines.map((o) => ({
        type: 'scatter' as const, mode: 'lines' as const, x: o.x, y: o.z, fill: 'toself' as const, fillcolor: 'rgba(194, 65, 12, 0.28)',
        line: { color: '#7c2d12', width: 1 }, hoverinfo: 'skip' as const,
      })),
      { type: 'scatter' as const, mode: 'lines' as const, x: band.median.x, y: band.median.z, line: { color: '#7c2d12', width: 2, dash: 'dash' as const }, connectgaps: false, hovertemplate: 'x %{x} m: median depth at %{y:.1f} m elevation<extra></extra>' },
    ];
  }, [xs, zs, section, colours.min, colours.max]);
  const title = `Mean velocity and the depth band of ${rockWords(section.rockVelocity)}`;
  return (
    <div data-testid="ensemble-mean">
      <RunPlot height={height} label={`${title}: mean velocity of the members where at least half cover the ground; the band of the rock depth drawn over it`} data={data} layout={layout(title)} config={RUN_CHART_CONFIG} />
    </div>
  );
}

/** Standard deviation of velocity between members (m/s). */
export function SpreadChart({ section, height = 300 }: { section: EnsembleSectionView; height?: number }) {
  const { xs, zs } = useMemo(() => gridAxes(section.grid), [section.grid]);
  const top = useMemo(() => Math.max(10, finiteRange(toFloat32(section.std))?.max ?? 10), [section.std]);
  const data = useMemo(
    () => [
      { type: 'heatmap' as const, x: xs, y: zs, z: heatmapRows(section.std, section.grid), zmin: 0, zmax: top, colorscale: SPREAD_SCALE, colorbar: { title: { text: 'm/s' }, thickness: 12 }, hovertemplate: 'x %{x} m, elevation %{y} m: ±%{z:.0f} m/s<extra></extra>', hoverongaps: false },
      ground(section),
    ],
    [xs, zs, section, top],
  );
  return (
    <div data-testid="ensemble-spread">
      <RunPlot height={height} label="Spread: standard deviation of velocity between the members, in m/s" data={data} layout={layout('Spread between members (standard deviation)')} config={RUN_CHART_CONFIG} />
    </div>
  );
}

/** Share of members in which the ground is faster than v*. */
export function ProbabilityChart({ section, height = 300 }: { section: EnsembleSectionView; height?: number }) {
  const { xs, zs } = useMemo(() => gridAxes(section.grid), [section.grid]);
  const data = useMemo(
    () => [
      { type: 'heatmap' as const, x: xs, y: zs, z: heatmapRows(section.probability, section.grid, undefined, 100), zmin: 0, zmax: 100, colorscale: PROBABILITY_SCALE, colorbar: { title: { text: '%' }, thickness: 12 }, hovertemplate: 'x %{x} m, elevation %{y} m: %{z:.0f} %% of members faster<extra></extra>', hoverongaps: false },
      ground(section),
    ],
    [xs, zs, section],
  );
  const title = `Share of members faster than ${rockWords(section.rockVelocity)}`;
  return (
    <div data-testid="ensemble-probability">
      <RunPlot height={height} label={`${title}, in per cent`} data={data} layout={layout(title)} config={RUN_CHART_CONFIG} />
    </div>
  );
}
