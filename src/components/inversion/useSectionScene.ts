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
export function useSectionScene(section: InversionSectionView, threshold: number, showContours: boolean, range?: { min: number; max: number }): InversionSectionScene & { maskedCount: number } {
  const arrays = useSectionArrays(section);
  const mask = useMemo(() => coverageMask(section.coverage, threshold), [section.coverage, threshold]);
  const colourRange = range ?? arrays.range;
  const contours = useMemo(() => {
    if (!showContours) return null;
    return isoVelocityContours(withoutMasked(arrays.velocity, mask), section.grid, isoVelocityLevels(colourRange.min, colourRange.max));
  }, [showContours, arrays.velocity, mask, section.grid, colourRange.min, colourRange.max]);
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
