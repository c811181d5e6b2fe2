import { Link } from 'react-router';
import type { AuditEntry } from '../../api/types';
import { DataTable, Td, Th, Tr } from '../Table';
import { dateTime } from './wording';

/** Plain words for the actions the server records; an unknown action is shown by its code alone. */
export const AUDIT_ACTION_LABELS: Record<string, string> = {
  'project.create': 'Created the project',
  'project.member.add': 'Added a member',
  'project.member.remove': 'Removed a member',
  'line.create': 'Created a line',
  'line.stations.replace': 'Replaced the station table',
  'pickset.upload': 'Uploaded a pick file',
  'pickset.revise': 'Revised pick exclusions',
  'model.save': 'Saved a model version',
  'run.start': 'Started a run',
  'run.cancel': 'Cancelled a run',
  'report.create': 'Started a report',
  'report.submit': 'Submitted a report',
  'report.return': 'Returned a report',
  'report.approve': 'Approved a report',
  'report.share': 'Shared a report with the client',
};

/** Pages an object can be opened on, for a viewer who is on the project team. */
const OBJECT_PAGES: Record<string, (id: string) => string> = {
  report: (id) => `/reports/${id}`,
  run: (id) => `/runs/${id}`,
  survey_line: (id) => `/lines/${id}`,
  velocity_model: (id) => `/models/${id}`,
};

/** "survey_line" → "survey line". */
const typeWords = (objectType: string) => objectType.replace(/_/g, ' ');

function ObjectCell({ entry, linkable }: { entry: AuditEntry; linkable: boolean }) {
  const { objectType, objectId } = entry;
  if (!objectId) return <span className="text-stone-700">{typeWords(objectType)}</span>;
  const page = linkable ? OBJECT_PAGES[objectType] : undefined;
  const short = objectId.length > 12 ? `${objectId.slice(0, 8)}…` : objectId;
  return (
    <span className="whitespace-nowrap">
      <span className="text-stone-700">{typeWords(objectType)}</span>{' '}
      {page ? (
        <Link to={page(objectId)} title={objectId} aria-label={`${typeWords(objectType)} ${objectId}`} className="font-mono text-sm">
          {short}
        </Link>
      ) : (
        <span title={objectId} className="font-mono text-sm text-stone-600">
          {short}
        </span>
      )}
    </span>
  );
}

const showValue = (v: unknown): string => (typeof v === 'string' ? v : JSON.stringify(v));

function DetailCell({ detail }: { detail: AuditEntry['detail'] }) {
  const entries = Object.entries(detail ?? {}).filter(([, v]) => v !== '' && v !== null && v !== undefined);
  if (entries.length === 0) return <span className="text-stone-400">—</span>;
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
      {entries.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-stone-600">{k}</dt>
          <dd className="break-words whitespace-pre-wrap text-stone-800">{showValue(v)}</dd>
        </div>
      ))}
    </dl>
  );
}

/** The audit trail: who did what to which object, and when, newest first. */
export function AuditTable({ entries, linkable }: { entries: AuditEntry[]; linkable: boolean }) {
  return (
    <DataTable caption="Audit trail, newest first" testId="audit-table" minWidth="56rem">
      <thead>
        <tr>
          <Th>When</Th>
          <Th>Who</Th>
          <Th>What</Th>
          <Th>Object</Th>
          <Th>Details</Th>
        </tr>
      </thead>
      <tbody>
        {entries.map((e) => (
          <Tr key={e.id} testId="audit-row">
            <Td className="whitespace-nowrap text-stone-700">
              <time dateTime={e.at}>{dateTime(e.at)}</time>
            </Td>
            <Td>
              {e.actor ? (
                <>
                  <span className="font-semibold text-stone-900">{e.actor}</span>
                  <span className="block text-sm whitespace-nowrap text-stone-600">{e.actorEmail}</span>
                </>
              ) : (
                <span className="text-stone-600">system or a former account</span>
              )}
            </Td>
            <Td>
              <span className="block text-stone-900">{AUDIT_ACTION_LABELS[e.action] ?? e.action}</span>
              <code className="text-sm text-stone-600">{e.action}</code>
            </Td>
            <Td>
              <ObjectCell entry={e} linkable={linkable} />
            </Td>
            <Td className="max-w-md">
              <DetailCell detail={e.detail} />
            </Td>
          </Tr>
        ))}
      </tbody>
    </DataTable>
  );
}
