import { useMemo } from 'react';
import type { InversionSectionView } from '../../../shared/schemas/inversions';
import { PLOTLY_RDBU } from '../run/misfit/divergingColor';
import { RunPlot } from '../run/plot/RunPlot';
import { RUN_CHART_CONFIG, RUN_CHART_FONT, runAxis } from '../run/plot/runChartTheme';
import { coverageMask } from './coverageMask';
import { gridAxes, heatmapRows } from './sectionArrays';

type Checkerboard = NonNullable<InversionSectionView['checkerboard']>;

/** How well the pattern came back, in words a reviewer can repeat (thresholds are common practice, no source). */
export function correlationWords(r: number): string {
  if (!Number.isFinite(r)) return 'could not be measured';
  if (r >= 0.8) return 'well recovered: features of this size are resolved where the section is not greyed';
  if (r >= 0.5) return 'partly recovered: features of this size show, but smeared; read their edges with care';
  return 'poorly recovered: features of this size are not resolved by this survey';
}

function PatternChart({ title, z, section, limit, testId }: { title: string; z: (number | null)[][]; section: InversionSectionView; limit: number; testId: string }) {
  const { xs, zs } = useMemo(() => gridAxes(section.grid), [section.grid]);
  const data = useMemo(
    () => [{ type: 'heatmap' as const, x: xs, y: zs, z, zmin: -limit, zmax: limit, colorscale: PLOTLY_RDBU, colorbar: { title: { text: '%' }, thickness: 12 }, hovertemplate: 'x %{x} m, elevation %{y} m: %{z:.1f} %<extra></extra>', hoverongaps: false }],
    [xs, zs, z, limit],
  );
  const layout = useMemo(
    () => ({
      font: RUN_CHART_FONT,
      margin: { l: 56, r: 16, t: 32, b: 44 },
      title: { text: title, font: { size: 15 } },
      paper_bgcolor: '#ffffff',
      plot_bgcolor: '#e7e5e4',
      xaxis: { ...runAxis, zeroline: false, title: { text: 'x along the line (m)' } },
      yaxis: { ...runAxis, zeroline: false, title: { text: 'elevation (m)' } },
    }),
    [title],
  );
  return (
    <div data-testid={testId}>
      <RunPlot height={260} label={`${title}: relative velocity anomaly in per cent`} data={data} layout={layout} config={RUN_CHART_CONFIG} />
    </div>
  );
}

/**
 * The checkerboard resolution test: a ±amplitude pattern of squares added to the final model, synthetic
 * picks with the same shots, geophones and uncertainties, inverted with the same settings. Where the
 * recovered pattern looks like the true one, the survey resolves features of that size.
 */
export function CheckerboardPanel({ section, checkerboard }: { section: InversionSectionView; checkerboard: Checkerboard }) {
  const mask = useMemo(() => coverageMask(section.coverage, checkerboard.coverageThreshold), [section.coverage, checkerboard.coverageThreshold]);
  const truth = useMemo(() => heatmapRows(checkerboard.truePattern, section.grid, undefined, 100), [checkerboard.truePattern, section.grid]);
  const recovered = useMemo(() => heatmapRows(checkerboard.recovered, section.grid, mask, 100), [checkerboard.recovered, section.grid, mask]);
  const limit = Math.max(1, Math.round(checkerboard.amplitude * 100 * 10) / 10);
  return (
    <div data-testid="checkerboard">
      <p className="mb-3 max-w-prose text-stone-800">
        Squares of {checkerboard.size} m, ±{(checkerboard.amplitude * 100).toFixed(0)}% of the final velocities. Correlation of the recovered with the
        true pattern in the ground with at least {checkerboard.coverageThreshold} m of ray:{' '}
        {checkerboard.correlation === null ? (
          <strong data-testid="checkerboard-correlation">not computable</strong>
        ) : (
          <>
            <strong data-testid="checkerboard-correlation">{checkerboard.correlation.toFixed(2)}</strong> — {correlationWords(checkerboard.correlation)}
          </>
        )}
        .
      </p>
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">
        <PatternChart title="Pattern put in" z={truth} section={section} limit={limit} testId="checkerboard-true" />
        <PatternChart title="Pattern recovered" z={recovered} section={section} limit={limit} testId="checkerboard-recovered" />
      </div>
      <p className="mt-1 text-sm text-stone-600">Blank in the recovered pattern: air, or too few rays for the correlation to count.</p>
    </div>
  );
}
