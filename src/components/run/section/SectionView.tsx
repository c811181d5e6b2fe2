import { useBoreholes } from '../../../api/boreholes';
import { useMemo, useState, type ReactNode } from 'react';
import { deepestInterfaceDepth, deepestLayerName } from '../../../../shared/boreholes';
import { evalPolyline } from '../../../../shared/model/polyline';
import { BoreholeTiesTable } from '../../boreholes/BoreholeTiesTable';
import { sToMs } from '../../../../shared/units';
import { errorMessage } from '../../../api/errors';
import { useModelGrid, usePrefetchFields, useRays, useRunModel, useRunShots, useShotField } from '../../../api/runs';
import type { RunDetail, Station } from '../../../api/types';
import { Button } from '../../Button';
import { SelectField } from '../../Field';
import { metres, ms } from '../format';
import { useElementWidth } from '../useElementWidth';
import { contourLevels, defaultContourInterval, finiteMax, usableIntervals } from './contourLevels';
import { SECTION_COLOURS } from './drawSection';
import { SectionCanvas, type SectionOverlay } from './SectionCanvas';
import { finiteRange } from './velocityColours';
import { SectionColoursControl } from '../../plot/colours/SectionColoursControl';
import { useLineSectionColours } from '../../plot/colours/useSectionColours';
import { wavefronts } from './wavefronts';

const EXAGGERATIONS = [1, 2, 3, 5] as const;

interface SectionViewProps {
  run: RunDetail;
  stations: Station[];
  shotIds: string[];
  shotId: string;
  highlightPick: number | null;
  onShot: (shotId: string) => void;
}

function LegendItem({ swatch, children }: { swatch: ReactNode; children: ReactNode }) {
  return (
    <li className="flex items-center gap-1.5">
      <span aria-hidden="true" className="inline-flex w-6 justify-center">
        {swatch}
      </span>
      {children}
    </li>
  );
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
  const ownRange = useMemo(() => (velocity.data ? finiteRange(velocity.data.values) : null), [velocity.data]);
  const colours = useLineSectionColours(run.lineId, ownRange);

  // The neighbours are one key press away: fetch them now so switching feels instant.
  const at = shotIds.indexOf(shotId);
  const neighbours = [shotIds[at - 1], shotIds[at + 1]].filter((s): s is string => Boolean(s));
  usePrefetchFields(run.id, neighbours);

  const maxMs = field.data ? sToMs(finiteMax(field.data.values)) : Number.NaN;
  const choices = Number.isFinite(maxMs) ? usableIntervals(maxMs) : [];
  const autoInterval = Number.isFinite(maxMs) ? defaultContourInterval(maxMs) : Number.NaN;
  const size = interval === 'auto' || !choices.includes(interval) ? autoInterval : interval;
  const levels = useMemo(() => (Number.isFinite(maxMs) ? contourLevels(maxMs, size) : null), [maxMs, size]);
  const fronts = useMemo(() => (field.data && levels ? wavefronts(field.data, field.data.source, levels) : null), [field.data, levels]);

  const file = model.data?.model;
  const holes = useBoreholes(run.lineId);
  const overlay = useMemo<SectionOverlay>(() => {
    const surface = (file?.surface as [number, number][] | undefined) ?? null;
    return {
      fronts,
      rays: showRays ? (rays.data ?? []) : [],
      highlightPick,
      surface,
      layerBases: (file?.layers ?? []).filter((l) => l.base).map((l) => ({ name: l.name ?? 'layer', base: l.base as [number, number][] })),
      stations,
      shots: (shots.data ?? []).map((s) => ({ shotId: s.shotId, x: s.sourceX, z: s.sourceZ ?? (surface ? evalPolyline(surface, s.sourceX) : Number.NaN) })),
      selectedShot: shotId,
      boreholes: holes.data ?? [],
    };
  }, [fronts, showRays, rays.data, highlightPick, file, stations, shots.data, shotId, holes.data]);

  // Ties to the logs: the top of the model's deepest layer, below its ground.
  const rockTop = useMemo(() => {
    const surface = file?.surface as [number, number][] | undefined;
    return file && surface && surface.length >= 2 ? deepestInterfaceDepth(file, (x) => evalPolyline(surface, x)) : null;
  }, [file]);

  const problem = velocity.error ?? field.error ?? rays.error ?? model.error;

  return (
    <div data-testid="section-view">
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <div className="flex items-end gap-2">
          <Button variant="secondary" aria-label="Previous shot" disabled={at <= 0} onClick={() => onShot(shotIds[at - 1]!)} data-testid="section-previous">
            ←
          </Button>
          <div className="w-36">
            <SelectField label="Shot" value={shotId} onChange={(e) => onShot(e.target.value)} data-testid="section-shot">
              {shotIds.map((s) => (
                <option key={s} value={s}>
                  {s}
                </option>
              ))}
            </SelectField>
          </div>
          <Button variant="secondary" aria-label="Next shot" disabled={at < 0 || at >= shotIds.length - 1} onClick={() => onShot(shotIds[at + 1]!)} data-testid="section-next">
            →
          </Button>
        </div>
        <div className="w-52">
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
        <SectionColoursControl colours={colours} />
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
        <p role="alert" className="mb-2 rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-900">
          The section could not be drawn completely: {errorMessage(problem)}
        </p>
      ) : null}
      <div ref={ref} className="overflow-x-auto rounded-lg border border-stone-200 bg-white p-2">
        {velocity.data ? (
          <SectionCanvas
            velocity={velocity.data}
            field={field.data ?? null}
            overlay={overlay}
            width={Math.max(320, width - 16)}
            exaggeration={ve}
            label={`Velocity section with the wavefronts and rays of shot ${shotId}, vertical exaggeration ${ve} times`}
            colourRange={colours.range}
          />
        ) : (
          <div role="status" className="flex h-72 items-center justify-center text-stone-600">
            Loading the model…
          </div>
        )}
      </div>
      <ul className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-sm text-stone-700" aria-label="Legend">
        <LegendItem swatch={<span className="block h-px w-6" style={{ background: SECTION_COLOURS.wavefront }} />}>Wavefronts (labels in ms)</LegendItem>
        <LegendItem swatch={<span className="block h-0.5 w-6" style={{ background: SECTION_COLOURS.rayChosen }} />}>Rays, receiver to shot</LegendItem>
        <LegendItem swatch={<span className="block w-6 border-t-2 border-dashed" style={{ borderColor: SECTION_COLOURS.base }} />}>Layer bases</LegendItem>
        <LegendItem swatch={<span className="block h-0.5 w-6" style={{ background: SECTION_COLOURS.surface }} />}>Ground surface</LegendItem>
        <LegendItem swatch={<span style={{ color: SECTION_COLOURS.station }}>▼</span>}>Stations (geophones)</LegendItem>
        <LegendItem swatch={<span style={{ color: SECTION_COLOURS.shotChosen }}>★</span>}>Shots (chosen one larger)</LegendItem>
      </ul>
      {file && rockTop && <BoreholeTiesTable holes={holes.data ?? []} depthAt={rockTop} surfaceName={deepestLayerName(file)} />}
    </div>
  );
}
