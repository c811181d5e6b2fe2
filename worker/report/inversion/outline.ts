/** The inversion report's numbered sections, in order; the checkerboard test only when it was run. */
import { plain } from '../format';
import { rockWords } from '../../../shared/uncertainty/wording';
import type { InversionReportInput } from './types';

export type InversionSectionKey = 'section' | 'isoDepth' | 'accuracy' | 'boreholes' | 'convergence' | 'misfit' | 'checkerboard' | 'method' | 'cautions';

export function inversionSections(input: InversionReportInput): InversionSectionKey[] {
  const all: InversionSectionKey[] = ['section', 'isoDepth', 'accuracy', 'boreholes', 'convergence', 'misfit', 'checkerboard', 'method', 'cautions'];
  return all.filter((k) => (k !== 'checkerboard' || input.inversion.checkerboard) && (k !== 'accuracy' || input.ensemble));
}

export function inversionSectionTitle(key: InversionSectionKey, input: InversionReportInput): string {
  switch (key) {
    case 'section': return 'Velocity section from the inversion';
    case 'isoDepth': return `Depth to the ${plain(input.isoVelocity, 0)} m/s surface`;
    case 'accuracy': return `Accuracy of the depth to ${rockWords(input.ensemble?.rock ?? { min: input.isoVelocity, max: input.isoVelocity })}`;
    case 'boreholes': return 'Boreholes and ties';
    case 'convergence': return 'Convergence';
    case 'misfit': return 'Misfit of the final model';
    case 'checkerboard': return 'Resolution: checkerboard test';
    case 'method': return 'Method statement and settings';
    case 'cautions': return 'Limitations and cautions';
  }
}

/** "7  Limitations and cautions", as the heading prints it. */
export function inversionHeadingText(key: InversionSectionKey, input: InversionReportInput): string {
  return `${inversionSections(input).indexOf(key) + 1}  ${inversionSectionTitle(key, input)}`;
}
