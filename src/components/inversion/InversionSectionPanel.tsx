import { useMemo, useState } from 'react';
import { useBoreholes } from '../../api/boreholes';
import type { InversionSectionView } from '../../../shared/schemas/inversions';
import { useElementWidth } from '../run/useElementWidth';
import { DEFAULT_COVERAGE_THRESHOLD_M, thresholdCeiling } from './coverageMask';
import { InversionSectionCanvas } from './InversionSectionCanvas';
import { SectionControls } from './SectionControls';
import { SectionLegend } from './SectionLegend';
import { useSectionScene } from './useSectionScene';

/** Narrower than this the section cannot be read; on a phone it scrolls sideways inside its frame instead. */
const MIN_SECTION_WIDTH = 560;

/** The final velocity section with its coverage mask, contours and depth-of-investigation line, and the controls for them. */
export function InversionSectionPanel({ section, lineId }: { section: InversionSectionView; lineId: string }) {
  const [threshold, setThreshold] = useState(DEFAULT_COVERAGE_THRESHOLD_M);
  const [ve, setVe] = useState(2);
  const [contours, setContours] = useState(true);
  const sectionScene = useSectionScene(section, threshold, contours);
  const holes = useBoreholes(lineId);
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
      />
      <p className="mb-2 text-sm text-stone-700" aria-live="polite" data-testid="inversion-section-caption" data-masked={scene.maskedCount}>
        {share}% of the ground is greyed: fewer than {threshold.toFixed(1)} m of ray crossed it, so its velocity comes from the smoothing and the
        starting model, not from the picks. Below the dashed line no ray turned.
        {ve !== 1 && ' Heights are exaggerated, so slopes look steeper than they are.'}
      </p>
      <div ref={ref} className="overflow-x-auto rounded-lg border border-stone-200 bg-white p-2">
        <InversionSectionCanvas scene={scene} width={Math.max(MIN_SECTION_WIDTH, width - 16)} exaggeration={ve} label={`Inverted velocity section, vertical exaggeration ${ve} times, ground with less than ${threshold.toFixed(1)} m of ray greyed`} />
      </div>
      <SectionLegend />
    </div>
  );
}
