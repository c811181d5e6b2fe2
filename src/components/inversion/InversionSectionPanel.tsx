import { useMemo, useState } from 'react';
import { useBoreholes } from '../../api/boreholes';
import type { RasterModel } from '../../../shared/model';
import { isoVelocityDepth } from '../../../shared/model/iso-depth';
import { evalPolyline } from '../../../shared/model/polyline';
import { BoreholeTiesTable } from '../boreholes/BoreholeTiesTable';
import type { InversionSectionView } from '../../../shared/schemas/inversions';
import { useElementWidth } from '../run/useElementWidth';
import { DEFAULT_COVERAGE_THRESHOLD_M, thresholdCeiling } from './coverageMask';
import { InversionSectionCanvas } from './InversionSectionCanvas';
import { SectionControls } from './SectionControls';
import { SectionLegend } from './SectionLegend';
import { useSectionArrays, useSectionScene } from './useSectionScene';
import { SectionColoursControl } from '../plot/colours/SectionColoursControl';
import { useLineSectionColours } from '../plot/colours/useSectionColours';

/** Where the ties start: a common threshold for weathered over sound rock (common practice, no source); the user sets the site's. */
const DEFAULT_ROCK_VELOCITY = 2500;

/** The section as the iso-depth reader wants it (grid, the scene's velocities, ground), or null without a ground line. */
function isoModel(section: InversionSectionView, velocity: Float32Array): RasterModel | null {
  const surface = section.surface;
  if (!surface) return null;
  return { grid: section.grid, velocity, surfaceZ: (at: number) => evalPolyline(surface, at) } as unknown as RasterModel;
}

/** Depth below ground of the first crossing of v* under x, or null where never reached or off the section. */
function isoDepthAt(model: RasterModel | null, velocity: number, x: number): number | null {
  if (!model) return null;
  const { grid } = model;
  if (x < grid.x0 || x > grid.x0 + (grid.nx - 1) * grid.dx) return null;
  return isoVelocityDepth(model, velocity, x).depth;
}

/** Narrower than this the section cannot be read; on a phone it scrolls sideways inside its frame instead. */
const MIN_SECTION_WIDTH = 560;

/** The final velocity section with its coverage mask, contours and depth-of-investigation line, and the controls for them. */
export function InversionSectionPanel({ section, lineId }: { section: InversionSectionView; lineId: string }) {
  const [threshold, setThreshold] = useState(DEFAULT_COVERAGE_THRESHOLD_M);
  const [ve, setVe] = useState(2);
  const [contours, setContours] = useState(true);
  const [rockVelocity, setRockVelocity] = useState(DEFAULT_ROCK_VELOCITY);
  const arrays = useSectionArrays(section);
  const colours = useLineSectionColours(lineId, arrays.range);
  const sectionScene = useSectionScene(section, arrays, threshold, contours, colours.range);
  const holes = useBoreholes(lineId);
  const iso = useMemo(() => isoModel(section, sectionScene.velocity), [section, sectionScene.velocity]);
  const scene = useMemo(() => ({ ...sectionScene, boreholes: holes.data ?? [] }), [sectionScene, holes.data]);
  const { ref, width } = useElementWidth<HTMLDivElement>();
  const ground = section.coverage.filter((c) => c !== null).length;
  const share = ground ? Math.round((100 * scene.maskedCount) / ground) : 0;
  return (
    <div data-testid="inversion-section">
      <SectionControls
        threshold={threshold}
        ceiling={thresholdCeiling(section.coverage)}
        onThreshold={setThreshold}
        exaggeration={ve}
        onExaggeration={setVe}
        contours={contours}
        onContours={setContours}
      >
        <SectionColoursControl colours={colours} />
      </SectionControls>
      <p className="mb-2 text-sm text-stone-700" aria-live="polite" data-testid="inversion-section-caption" data-masked={scene.maskedCount}>
        {share}% of the ground is greyed: fewer than {threshold.toFixed(1)} m of ray crossed it, so its velocity comes from the smoothing and the
        starting model, not from the picks. Below the dashed line no ray turned.
        {ve !== 1 && ' Heights are exaggerated, so slopes look steeper than they are.'}
      </p>
      <div ref={ref} className="overflow-x-auto rounded-lg border border-stone-200 bg-white p-2">
        <InversionSectionCanvas scene={scene} width={Math.max(MIN_SECTION_WIDTH, width - 16)} exaggeration={ve} label={`Inverted velocity section, vertical exaggeration ${ve} times, ground with less than ${threshold.toFixed(1)} m of ray greyed`} />
      </div>
      <SectionLegend />
      <BoreholeTiesTable holes={holes.data ?? []} depthAt={(x) => isoDepthAt(iso, rockVelocity, x)} surfaceName={`the ${rockVelocity} m/s iso-velocity`}>
        <label className="flex items-center gap-2 text-sm font-semibold text-stone-700">
          Top of rock at (m/s)
          <input type="number" min={100} step={100} className="w-24 rounded-md border border-stone-300 px-2 py-1 tabular-nums" value={rockVelocity} onChange={(e) => Number(e.target.value) > 0 && setRockVelocity(Number(e.target.value))} data-testid="ties-velocity" />
        </label>
      </BoreholeTiesTable>
    </div>
  );
}
