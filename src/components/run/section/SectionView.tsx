import { useMemo, useState } from 'react';
import type { Layout } from 'plotly.js';
import { evalPolyline } from '../../../../shared/model/polyline';
import { sToMs } from '../../../../shared/units';
import { errorMessage } from '../../../api/errors';
import { useModelGrid, usePrefetchFields, useRays, useRunModel, useRunShots, useShotField } from '../../../api/runs';
import type { RunDetail, Station } from '../../../api/types';
import { SelectField } from '../../Field';
import { Button } from '../../Button';
import { metres, ms } from '../format';
import { RunPlot } from '../plot/RunPlot';
import { RUN_CHART_CONFIG, RUN_CHART_FONT, runAxis } from '../plot/runChartTheme';
import { useElementWidth } from '../useElementWidth';
import { contourLevels, defaultContourInterval, finiteMax, usableIntervals } from './contourLevels';
import { sectionHeight } from './sectionData';
import { geometryTraces, rayTraces, velocityTrace, wavefrontTraces } from './sectionTraces';

const EXAGGERATIONS = [1, 2, 3, 5] as const;
/** Room around the drawing area: axis titles, tick labels, colour bar and legend (px). */
const CHROME = { left: 70, right: 110, top: 56, bottom: 70 };

interface SectionViewProps {
  run: RunDetail;
  stations: Station[];
  shotIds: string[];
  shotId: string;
  highlightPick: number | null;
  onShot: (shotId: string) => void;
}

/**
 * The model in section: velocities as colour, the chosen shot's first-arrival wavefronts as labelled
 * contours, its rays to the receivers, and the stations and shots, at a chosen vertical exaggeration.
 */
export function SectionView({ run, stations, shotIds, shotId, highlightPick, onShot }: SectionViewProps) {
  const model = useRunModel(run.modelId);
  const velocity = useModelGrid(run.modelId);
  const field = useShotField(run.id, shotId);
  const rays = useRays(run.id, shotId);
  const shots = useRunShots(run.pickSetId, run.pickSetRevision);
  const [interval, setInterval] = useState<number | 'auto'>('auto');
  const [ve, setVe] = useState<number>(2);
  const [showRays, setShowRays] = useState(true);
  const { ref, width } = useElementWidth<HTMLDivElement>();

  // The neighbours are one key press away: fetch them now so switching feels instant.
  const at = shotIds.indexOf(shotId);
  const neighbours = [shotIds[at - 1], shotIds[at + 1]].filter((s): s is string => Boolean(s));
  usePrefetchFields(run.id, neighbours);

  const maxMs = field.data ? sToMs(finiteMax(field.data.values)) : Number.NaN;
  const choices = Number.isFinite(maxMs) ? usableIntervals(maxMs) : [];
  const autoInterval = Number.isFinite(maxMs) ? defaultContourInterval(maxMs) : Number.NaN;
  const size = interval === 'auto' || !choices.includes(interval) ? autoInterval : interval;
  const levels = useMemo(() => (Number.isFinite(maxMs) ? contourLevels(maxMs, size) : null), [maxMs, size]);

  const file = model.data?.model;
  const shotMarks = useMemo(() => {
    if (!shots.data) return [];
    return shots.data.map((s) => ({
      shotId: s.shotId,
      x: s.sourceX,
      z: s.sourceZ ?? (file?.surface ? evalPolyline(file.surface, s.sourceX) : Number.NaN),
    }));
  }, [shots.data, file]);

  // One memo per group of traces, so a new shot leaves the heatmap's arrays (and plotly's work on them) alone.
  const velocityLayer = useMemo(() => (velocity.data ? velocityTrace(velocity.data) : null), [velocity.data]);
  const wavefronts = useMemo(() => (field.data && levels ? wavefrontTraces(field.data, field.data.source, levels) : []), [field.data, levels]);
  const rayLayer = useMemo(() => (showRays && rays.data ? rayTraces(rays.data, highlightPick) : []), [showRays, rays.data, highlightPick]);
  const geometry = useMemo(
    () =>
      geometryTraces({
        surface: (file?.surface as [number, number][] | undefined) ?? null,
        layerBases: (file?.layers ?? []).filter((l) => l.base).map((l) => ({ name: l.name ?? 'layer', base: l.base as [number, number][] })),
        stations,
        shots: shotMarks,
        selectedShot: shotId,
      }),
    [file, stations, shotMarks, shotId],
  );
  const data = useMemo(
    () => (velocityLayer ? [velocityLayer, ...wavefronts, ...rayLayer, ...geometry] : []),
    [velocityLayer, wavefronts, rayLayer, geometry],
  );

  const grid = velocity.data?.grid;
  const plotWidth = Math.max(200, width - CHROME.left - CHROME.right);
  const height = grid ? sectionHeight(grid, plotWidth, ve, CHROME.top + CHROME.bottom) : 320;
  const layout = useMemo<Partial<Layout>>(
    () => ({
      font: RUN_CHART_FONT,
      uirevision: `${run.id}:${ve}`,
      margin: { l: CHROME.left, r: 20, t: CHROME.top, b: CHROME.bottom },
      paper_bgcolor: 'white',
      plot_bgcolor: '#fafaf9',
      hovermode: 'closest',
      legend: { orientation: 'h', yanchor: 'bottom', y: 1, x: 0, font: { size: 13 } },
      xaxis: { ...runAxis, title: { text: 'x along the line (m)' }, showgrid: false, zeroline: false },
      yaxis: { ...runAxis, title: { text: 'elevation (m)' }, scaleanchor: 'x', scaleratio: ve, constrain: 'domain', showgrid: false, zeroline: false },
    }),
    [run.id, ve],
  );

  const problem = velocity.error ?? field.error ?? rays.error ?? model.error;
  const waiting = velocity.isPending;

  return (
    <div data-testid="section-view">
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <div className="flex items-end gap-2">
          <Button variant="secondary" size="sm" aria-label="Previous shot" disabled={at <= 0} onClick={() => onShot(shotIds[at - 1]!)}>
            ←
          </Button>
          <div className="w-40">
            <SelectField label="Shot" value={shotId} onChange={(e) => onShot(e.target.value)} data-testid="section-shot">
              {shotIds.map((s) => (
                <option key={s} value={s}>
                  {s}
                </option>
              ))}
            </SelectField>
          </div>
          <Button variant="secondary" size="sm" aria-label="Next shot" disabled={at < 0 || at >= shotIds.length - 1} onClick={() => onShot(shotIds[at + 1]!)}>
            →
          </Button>
        </div>
        <div className="w-48">
          <SelectField
            label="Wavefront every"
            value={String(interval)}
            onChange={(e) => setInterval(e.target.value === 'auto' ? 'auto' : Number(e.target.value))}
            data-testid="contour-interval"
          >
            <option value="auto">{Number.isFinite(autoInterval) ? `Automatic (${autoInterval} ms)` : 'Automatic'}</option>
            {choices.map((c) => (
              <option key={c} value={c}>
                {c} ms
              </option>
            ))}
          </SelectField>
        </div>
        <div className="w-56">
          <SelectField label="Vertical exaggeration" value={String(ve)} onChange={(e) => setVe(Number(e.target.value))} data-testid="vertical-exaggeration">
            {EXAGGERATIONS.map((v) => (
              <option key={v} value={v}>
                {v === 1 ? '1× (true scale)' : `${v}×`}
              </option>
            ))}
          </SelectField>
        </div>
        <label className="flex items-center gap-2 pb-2">
          <input type="checkbox" checked={showRays} onChange={(e) => setShowRays(e.target.checked)} className="accent-accent-700" />
          Show rays
        </label>
      </div>

      <p data-testid="section-caption" className="mb-2 text-sm text-stone-700" aria-live="polite">
        {field.data?.source
          ? `Shot ${shotId} at x = ${metres(field.data.source.x)}, elevation ${metres(field.data.source.z)}: latest first arrival in the model ${ms(maxMs, 1)}` +
            (levels ? `; wavefronts every ${levels.size} ms, labelled in ms` : '') +
            (rays.data ? `; ${rays.data.length} rays.` : '.')
          : field.isPending
            ? `Loading shot ${shotId}…`
            : ''}
        {ve !== 1 && ' Heights are exaggerated, so slopes and angles look steeper than they are.'}
      </p>
      {problem ? (
        <p role="alert" className="rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-900">
          The section could not be drawn: {errorMessage(problem)}
        </p>
      ) : null}
      <div ref={ref}>
        {waiting ? (
          <div role="status" style={{ height }} className="flex items-center justify-center rounded-lg border border-stone-200 bg-white text-stone-600">
            Loading the model…
          </div>
        ) : (
          <RunPlot
            height={height}
            label={`Velocity section with the wavefronts and rays of shot ${shotId}`}
            data={data}
            layout={layout}
            config={RUN_CHART_CONFIG}
          />
        )}
      </div>
    </div>
  );
}
