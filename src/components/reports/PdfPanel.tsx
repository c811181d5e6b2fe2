import { isRendering } from '../../api/reports';
import type { ReportDetail } from '../../api/types';
import { PdfDownload } from './PdfDownload';
import { dateTime } from './wording';

/** The report's PDF: the download once it is made, and an honest word while it is not. */
export function PdfPanel({ report, forClient = false }: { report: ReportDetail; forClient?: boolean }) {
  const { state, error, renderedAt } = report.render;
  return (
    <div data-testid="pdf-panel" className="rounded-lg border border-stone-200 bg-white p-5 shadow-xs">
      <h2 className="text-lg font-semibold text-stone-900">PDF summary</h2>
      <div className="mt-3 flex flex-wrap items-center gap-x-4 gap-y-2">
        <PdfDownload reportId={report.id} state={state} />
        {state === 'ready' && renderedAt && <span className="text-sm text-stone-600">Made {dateTime(renderedAt)}</span>}
      </div>
      <p className="mt-3 text-sm text-stone-700" data-testid="report-exports">
        The same section for CAD and GIS:{' '}
        {[
          ['section.dxf', 'DXF'],
          ['depth-to-rock.csv', 'depth-to-rock table (CSV)'],
          ...(report.mapped ? [['depth-to-rock.geojson', 'GeoJSON']] : []),
        ].map(([file, label], i) => (
          <span key={file}>
            {i > 0 && ' · '}
            <a href={`/api/reports/${report.id}/export/${file}`} download data-testid={`report-export-${file}`}>
              {label}
            </a>
          </span>
        ))}
        . Depth to rock is read at the report&rsquo;s {report.options.isoVelocity} m/s iso-velocity.
      </p>
      {isRendering(state) && (
        <p role="status" data-testid="pdf-pending" className="mt-3 max-w-prose text-stone-700">
          {state === 'queued' ? 'The PDF is waiting for the worker.' : 'The PDF is being drawn.'} This page checks again every few seconds;
          {report.pdfReady && !forClient ? ' the download returns once the new version (with the review status on its cover) is made.' : ' a demo report takes a few seconds.'}
        </p>
      )}
      {state === 'failed' && (
        <p role="alert" data-testid="pdf-failed" className="mt-3 max-w-prose rounded-md border border-red-300 bg-red-50 px-3 py-2 text-red-900">
          {error ?? 'The PDF could not be made.'}
          {!forClient && ' Start a new report from the run once the cause is fixed.'}
        </p>
      )}
    </div>
  );
}
