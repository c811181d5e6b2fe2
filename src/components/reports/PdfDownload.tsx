import { isRendering, reportPdfUrl } from '../../api/reports';
import type { ReportRenderState } from '../../api/types';

const LINK =
  'inline-flex items-center justify-center gap-2 rounded-md border font-semibold no-underline bg-accent-700 text-white border-accent-700 hover:bg-accent-800 hover:border-accent-800 hover:text-white';

/**
 * The PDF download: a plain link (same-origin GET with the session cookie), or a disabled
 * look-alike with the reason while the worker is still making the file.
 */
export function PdfDownload({ reportId, state, label = 'Download PDF', size = 'md' }: { reportId: string; state: ReportRenderState; label?: string; size?: 'md' | 'sm' }) {
  const sizing = size === 'sm' ? 'px-3 py-1 text-sm' : 'px-4 py-2';
  if (state === 'ready') {
    return (
      <a href={reportPdfUrl(reportId)} download className={`${LINK} ${sizing}`} data-testid="pdf-download">
        {label}
      </a>
    );
  }
  return (
    <span
      role="link"
      aria-disabled="true"
      data-testid="pdf-download-disabled"
      className={`inline-flex cursor-not-allowed items-center rounded-md border border-stone-300 bg-stone-100 font-semibold text-stone-500 ${sizing}`}
    >
      {isRendering(state) ? 'PDF being prepared…' : 'No PDF'}
    </span>
  );
}
