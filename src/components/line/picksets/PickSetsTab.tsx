import type { LineDetail, PickSetCreated } from '../../../api/types';
import { EmptyState } from '../../EmptyState';
import { Section } from '../../Section';
import { PickSetList } from './PickSetList';
import { PickUpload } from './PickUpload';

export function PickSetsTab({ line, canUpload, checksHref, onUploaded }: { line: LineDetail; canUpload: boolean; checksHref: (id: string) => string; onUploaded: (created: PickSetCreated) => void }) {
  return (
    <>
      {canUpload && (
        <Section title="Upload picks" description="A file is checked as a whole: if any line breaks a rule nothing is stored, and every problem is listed with its line and column.">
          <PickUpload lineId={line.id} onUploaded={onUploaded} />
        </Section>
      )}
      <Section title="Pick sets" description="Each upload is kept exactly as sent. Exclusions make new revisions; the original stays.">
        {line.pickSets.length === 0 ? (
          <EmptyState title="No pick sets yet" testId="picksets-empty">
            {canUpload ? 'Drop the first pick file above.' : 'A field technician or geophysicist uploads the pick files.'}
          </EmptyState>
        ) : (
          <PickSetList pickSets={line.pickSets} checksHref={checksHref} lineId={line.id} canRetire={canUpload} />
        )}
      </Section>
    </>
  );
}
