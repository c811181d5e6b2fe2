import { useMemo, useState } from 'react';
import { DEFAULT_VELOCITY_COLOURS, velocityRangeProblem, widenUniform, type VelocityColourRange } from '../../../../shared/colour/velocity-scale';
import { useLine } from '../../../api/lines';
import { useProject } from '../../../api/projects';

/** Where a section's colour range comes from: the project's setting, the section's own values, or this view. */
export type ColourSource = 'project' | 'section' | 'custom';

export interface SectionColours {
  /** The range the section is drawn on. */
  range: VelocityColourRange;
  source: ColourSource;
  setSource: (s: ColourSource) => void;
  /** The viewer's own range (used when source is 'custom'). */
  custom: VelocityColourRange;
  setCustom: (r: VelocityColourRange) => void;
  /** Why the custom range is not used, or null. */
  customProblem: string | null;
  projectRange: VelocityColourRange;
  /** The section's own velocities, when known. */
  sectionRange: VelocityColourRange | null;
}

/**
 * The colour range of one view (issue 17 item 6). By default the project's range, so the same
 * velocity has the same colour on every page and in the report; the viewer may stretch the scale
 * over this section's own values or set a range for this view only (not saved).
 */
export function useSectionColours(projectId: string | undefined, sectionRange: VelocityColourRange | null): SectionColours {
  const project = useProject(projectId ?? '', { enabled: Boolean(projectId) });
  const projectMin = project.data?.velocityColours.min ?? DEFAULT_VELOCITY_COLOURS.min;
  const projectMax = project.data?.velocityColours.max ?? DEFAULT_VELOCITY_COLOURS.max;
  const [source, setSource] = useState<ColourSource>('project');
  const [custom, setCustom] = useState<VelocityColourRange>({ min: projectMin, max: projectMax });
  const customProblem = velocityRangeProblem(custom);
  const sMin = sectionRange?.min, sMax = sectionRange?.max;
  const range = useMemo(() => {
    if (source === 'section' && sMin !== undefined && sMax !== undefined) return widenUniform({ min: sMin, max: sMax });
    if (source === 'custom' && !customProblem) return { min: custom.min, max: custom.max };
    return { min: projectMin, max: projectMax };
  }, [source, sMin, sMax, customProblem, custom.min, custom.max, projectMin, projectMax]);
  const projectRange = useMemo(() => ({ min: projectMin, max: projectMax }), [projectMin, projectMax]);
  // Setting a range starts from the one on screen, rounded to 50 m/s.
  const chooseSource = (next: ColourSource) => {
    if (next === 'custom' && source !== 'custom') setCustom({ min: Math.round(range.min / 50) * 50, max: Math.round(range.max / 50) * 50 });
    setSource(next);
  };
  return { range, source, setSource: chooseSource, custom, setCustom, customProblem, projectRange, sectionRange };
}

/** The same, for a view that knows its survey line rather than its project. */
export function useLineSectionColours(lineId: string, sectionRange: VelocityColourRange | null): SectionColours {
  const line = useLine(lineId);
  return useSectionColours(line.data?.projectId, sectionRange);
}
