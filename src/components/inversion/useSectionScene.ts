import { useMemo } from 'react';
import type { InversionSectionView } from '../../../shared/schemas/inversions';
import { coverageMask } from './coverageMask';
import type { InversionSectionScene } from './InversionSectionCanvas';
import { coveredRange, doiPolylines, toFloat32, withoutMasked } from './sectionArrays';
import { isoVelocityContours, isoVelocityLevels } from './velocityContours';

/** The typed arrays of a section, converted once per section. */
export function useSectionArrays(section: InversionSectionView) {
  return useMemo(() => {
    const velocity = toFloat32(section.velocity);
    const coverage = toFloat32(section.coverage);
    return { velocity, coverage, range: coveredRange(velocity, coverage) ?? { min: 0, max: 1 }, doi: doiPolylines(section.doi, section.grid) };
  }, [section]);
}

/**
 * What the canvas draws for a threshold: the mask, and contours that stop where the mask starts
 * (an iso-velocity line through cells no ray crossed would suggest knowledge the picks do not hold).
 */
export function useSectionScene(
  section: InversionSectionView,
  arrays: ReturnType<typeof useSectionArrays>,
  threshold: number,
  showContours: boolean,
  colourRange: { min: number; max: number },
  contourRange: { min: number; max: number } = arrays.range,
): InversionSectionScene & { maskedCount: number } {
  const mask = useMemo(() => coverageMask(section.coverage, threshold), [section.coverage, threshold]);
  const contours = useMemo(() => {
    if (!showContours) return null;
    // Levels over the section's own velocities: a wide project colour scale must not thin them out.
    return isoVelocityContours(withoutMasked(arrays.velocity, mask), section.grid, isoVelocityLevels(contourRange.min, contourRange.max));
  }, [showContours, arrays.velocity, mask, section.grid, contourRange.min, contourRange.max]);
  return useMemo(() => {
    let maskedCount = 0;
    for (const m of mask) maskedCount += m;
    return {
      grid: section.grid,
      velocity: arrays.velocity,
      range: colourRange,
      mask,
      coverage: arrays.coverage,
      contours,
      doi: arrays.doi,
      surface: section.surface,
      stations: section.stations,
      shots: section.shots,
      maskedCount,
    };
  }, [section, arrays, colourRange, mask, contours]);
}
