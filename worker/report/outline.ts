/** The report's numbered sections, in order. The cover is unnumbered. */
import { plain } from './format';
import type { ReportInput } from './types';

export const SECTION_ORDER = ['survey', 'section', 'isoDepth', 'curves', 'misfit', 'method', 'cautions'] as const;
export type SectionKey = (typeof SECTION_ORDER)[number];

export const sectionNumber = (key: SectionKey): number => SECTION_ORDER.indexOf(key) + 1;

export function sectionTitle(key: SectionKey, input: ReportInput): string {
  switch (key) {
    case 'survey': return 'The survey';
    case 'section': return 'Velocity section';
    case 'isoDepth': return `Depth to the ${plain(input.isoVelocity, 0)} m/s surface`;
    case 'curves': return 'Travel-time curves';
    case 'misfit': return 'Misfit';
    case 'method': return 'Method statement';
    case 'cautions': return 'Limitations and cautions';
  }
}

/** "7  Limitations and cautions", as the heading prints it. */
export const sectionHeadingText = (key: SectionKey, input: ReportInput): string => `${sectionNumber(key)}  ${sectionTitle(key, input)}`;
