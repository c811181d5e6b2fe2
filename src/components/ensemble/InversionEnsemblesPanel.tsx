import { Link } from 'react-router';
import { useInversionEnsembles } from '../../api/ensembles';
import type { InversionView } from '../../../shared/schemas/inversions';
import { rockWords } from '../../../shared/uncertainty/wording';
import { Disclosure } from '../Disclosure';
import { LoadError } from '../LoadState';
import { when } from '../run/format';
import { DataTable, Td, Th, Tr } from '../Table';
import { EnsembleStatusBadge } from './EnsembleStatusBadge';
import { StartEnsembleForm } from './StartEnsembleForm';

/** On a finished inversion's page: its ensembles (how sure is the depth to rock?) and, for a geophysicist, the form to start one. */
export function InversionEnsemblesPanel({ inversion, canStart }: { inversion: InversionView; canStart: boolean }) {
  const list = useInversionEnsembles(inversion.id);
  return (
    <div data-testid="inversion-ensembles">
      <p className="mb-3 max-w-prose text-stone-700">
        One tomogram hides how far the picks allow another. An ensemble repeats this inversion many times with what is uncertain drawn anew, and bands the depth of
        rock at each station from the members that still explain the picks.
      </p>
      {list.isError && <LoadError error={list.error} what="ensembles" onRetry={() => void list.refetch()} />}
      {list.data && list.data.length > 0 && (
        <div className="mb-4">
          <DataTable caption="Ensembles of this inversion" testId="ensembles-table" minWidth="32rem">
            <thead>
              <tr>
                <Th>Ensemble</Th>
                <Th>State</Th>
                <Th numeric>Members</Th>
                <Th>Rock velocity</Th>
              </tr>
            </thead>
            <tbody>
              {list.data.map((e) => (
                <Tr key={e.id}>
                  <Td>
                    <Link className="font-semibold text-accent-800 underline" to={`/lines/${inversion.lineId}/ensembles/${e.id}`}>
                      {e.label || `Ensemble of ${when(e.createdAt)}`}
                    </Link>
                  </Td>
                  <Td>
                    <EnsembleStatusBadge status={e.status} />
                  </Td>
                  <Td numeric>
                    {e.progress.done + e.progress.failed} / {e.members}
                    {e.stats && <span className="block text-sm text-stone-600">{e.stats.used} used</span>}
                  </Td>
                  <Td>{rockWords(e.rockVelocity)}</Td>
                </Tr>
              ))}
            </tbody>
          </DataTable>
        </div>
      )}
      {canStart ? (
        <Disclosure label="Start an ensemble" testId="start-ensemble-toggle">
          {() => (
            <div className="mt-4">
              <StartEnsembleForm inversionId={inversion.id} lineId={inversion.lineId} />
            </div>
          )}
        </Disclosure>
      ) : (
        list.data?.length === 0 && <p className="text-stone-600">No ensemble yet; geophysicists start them.</p>
      )}
    </div>
  );
}
