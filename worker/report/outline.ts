/** The report's numbered sections, in order. The cover is unnumbered. */
import { readInterpretationRecord } from '../../shared/layers/record';
import { plain } from './format';
import type { ReportInput } from './types';

export const SECTION_ORDER = ['survey', 'section', 'isoDepth', 'boreholes', 'layers', 'curves', 'misfit', 'method', 'cautions'] as const;
export type SectionKey = (typeof SECTION_ORDER)[number];

/** The sections this report has: "Layer interpretation" only when the model was saved from one. */
export const sectionsOf = (input: ReportInput): SectionKey[] =>
  SECTION_ORDER.filter((key) => key !== 'layers' || readInterpretationRecord(input.model.file) !== null);

export const sectionNumber = (key: SectionKey, input: ReportInput): number => sectionsOf(input).indexOf(key) + 1;

export function sectionTitle(key: SectionKey, input: ReportInput): string {
  switch (key) {
    case 'survey': return 'The survey';
    case 'section': return 'Velocity section';
    case 'isoDepth': return `Depth to the ${plain(input.isoVelocity, 0)} m/s surface`;
    case 'boreholes': return 'Boreholes and ties';
    case 'layers': return 'Layer interpretation behind the model';
    case 'curves': return 'Travel-time curves';
    case 'misfit': return 'Misfit';
    case 'method': return 'Method statement';
    case 'cautions': return 'Limitations and cautions';
  }
}

/** "7  Limitations and cautions", as the heading prints it. */
export const sectionHeadingText = (key: SectionKey, input: ReportInput): string => `${sectionNumber(key, input)}  ${sectionTitle(key, input)}`;
