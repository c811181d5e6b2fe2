import type { ReactNode } from 'react';
import { usePreview, type PreviewJob, type PreviewState } from './usePreview';

/**
 * Holds the preview's state below the editor, so a reply from the worker re-renders only what
 * draws it (the section and the preview panel), not the whole editor with its tables.
 */
export function WithPreview({ job, children }: { job: PreviewJob | null; children: (preview: PreviewState) => ReactNode }) {
  return children(usePreview(job));
}
