import { useState } from 'react';
import { errorMessage } from '../../../api/errors';
import { useRetirePickSet } from '../../../api/picksets';
import type { PickSetSummary } from '../../../api/types';
import { Button } from '../../Button';

/**
 * Retire a mistaken pick set (a reason is required) or bring it back. Retired sets leave the choices
 * for new work; runs, inversions and reports that used them keep them.
 */
export function RetirePickSet({ pickSet, lineId }: { pickSet: PickSetSummary; lineId: string }) {
  const change = useRetirePickSet(pickSet.id, lineId);
  const [asking, setAsking] = useState(false);
  const [reason, setReason] = useState('');
  if (pickSet.retired) {
    return (
      <Button variant="secondary" size="sm" busy={change.isPending} busyLabel="Reinstating…" onClick={() => change.mutate(null)} data-testid={`reinstate-${pickSet.id}`}>
        Reinstate
      </Button>
    );
  }
  if (!asking) {
    return (
      <Button variant="secondary" size="sm" onClick={() => setAsking(true)} data-testid={`retire-${pickSet.id}`}>
        Retire
      </Button>
    );
  }
  return (
    <form
      className="flex flex-wrap items-center justify-end gap-2 whitespace-normal"
      onSubmit={(e) => {
        e.preventDefault();
        if (reason.trim()) change.mutate(reason.trim(), { onSuccess: () => setAsking(false) });
      }}
    >
      <span className="max-w-xs text-left text-sm text-stone-800">No longer offered for new runs, inversions or checks; what already used it keeps it.</span>
      <input
        aria-label={`Why retire ${pickSet.fileName}`}
        placeholder="Reason, e.g. wrong shot file"
        value={reason}
        maxLength={500}
        onChange={(e) => setReason(e.target.value)}
        data-testid={`retire-reason-${pickSet.id}`}
        className="w-56 rounded-md border border-stone-300 px-2 py-1 text-sm"
      />
      <Button type="submit" variant="danger" size="sm" disabled={!reason.trim()} busy={change.isPending} busyLabel="Retiring…" data-testid={`retire-confirm-${pickSet.id}`}>
        Confirm: retire
      </Button>
      <Button variant="quiet" size="sm" onClick={() => setAsking(false)}>
        Keep
      </Button>
      {change.isError && (
        <span role="alert" className="w-full text-right text-sm font-semibold text-red-800">
          {errorMessage(change.error)}
        </span>
      )}
    </form>
  );
}
