import { Link } from 'react-router';
import { reportPdfUrl } from '../../api/reports';
import type { ReportSummary } from '../../api/types';
import { DataTable, Td, Th, Tr } from '../Table';
import { PdfDownload } from './PdfDownload';
import { ReportStatusBadge } from './ReportStatusBadge';
import { dateTime, RENDER_LABELS } from './wording';

/** The project team's view: every report with its review status and whether its PDF is ready. */
export function TeamReportsTable({ reports }: { reports: ReportSummary[] }) {
  return (
    <DataTable caption="Reports of this project, newest first" testId="reports-table">
      <thead>
        <tr>
          <Th>Report</Th>
          <Th>Status</Th>
          <Th>Prepared by</Th>
          <Th>Created</Th>
          <Th>PDF</Th>
        </tr>
      </thead>
      <tbody>
        {reports.map((r) => (
          <Tr key={r.id} testId="report-row">
            <Td>
              <Link to={`/reports/${r.id}`} className="font-semibold" aria-label={`Report on line ${r.line}, created ${dateTime(r.createdAt)}`}>
                Line {r.line}
              </Link>
            </Td>
            <Td>
              <ReportStatusBadge status={r.status} />
            </Td>
            <Td>{r.createdBy ?? <span className="text-stone-500">former member</span>}</Td>
            <Td className="whitespace-nowrap text-stone-700">{dateTime(r.createdAt)}</Td>
            <Td className={r.renderState === 'failed' ? 'font-semibold text-red-800' : 'text-stone-700'}>
              {r.renderState === 'ready' ? (
                <a href={reportPdfUrl(r.id)} download aria-label={`Download the PDF of the report on line ${r.line}, created ${dateTime(r.createdAt)}`}>
                  Download
                </a>
              ) : (
                RENDER_LABELS[r.renderState]
              )}
            </Td>
          </Tr>
        ))}
      </tbody>
    </DataTable>
  );
}

/** A client's view: shared reports only, each with its download; no staff names, nothing points at lines or runs. */
export function ClientReportsTable({ reports }: { reports: ReportSummary[] }) {
  return (
    <DataTable caption="Reports shared with you, newest first" testId="reports-table" minWidth="32rem">
      <thead>
        <tr>
          <Th>Report</Th>
          <Th>Created</Th>
          <Th>
            <span className="sr-only">Download</span>
          </Th>
        </tr>
      </thead>
      <tbody>
        {reports.map((r) => (
          <Tr key={r.id} testId="report-row">
            <Td>
              <Link to={`/reports/${r.id}`} className="font-semibold" aria-label={`Report on line ${r.line}, created ${dateTime(r.createdAt)}`}>
                Line {r.line}
              </Link>
            </Td>
            <Td className="whitespace-nowrap text-stone-700">{dateTime(r.createdAt)}</Td>
            <Td className="text-right">
              <PdfDownload reportId={r.id} state={r.renderState} size="sm" />
            </Td>
          </Tr>
        ))}
      </tbody>
    </DataTable>
  );
}
