import { useCallback, useMemo, useState } from 'react';
import { useCreateRevision } from '../../../api/picksets';
import type { PickSetDetail } from '../../../api/types';

const savedExclusions = (data: PickSetDetail) => new Map(data.picks.filter((p) => p.excluded).map((p) => [p.index, p.exclusionReason ?? '']));

/**
 * The exclusion list being edited (pick index → reason) and the picks selected for the next
 * step. It starts from the shown revision's list and starts again whenever another revision is
 * shown; saving posts the whole list as a new revision.
 */
export function useExclusionDraft(data: PickSetDetail, onRevisionSaved: (revision: number) => void) {
  const saved = useMemo(() => savedExclusions(data), [data]);
  const [draft, setDraft] = useState<Map<number, string>>(saved);
  const [draftOf, setDraftOf] = useState(data);
  const [selected, setSelected] = useState<Set<number>>(new Set());
  const revise = useCreateRevision(data.id, data.lineId);

  if (draftOf !== data) {
    setDraftOf(data);
    setDraft(saved);
    setSelected(new Set());
  }

  const excluded = useMemo(() => new Set(draft.keys()), [draft]);
  const added = [...draft].filter(([i, reason]) => saved.get(i) !== reason).length;
  const removed = [...saved.keys()].filter((i) => !draft.has(i)).length;

  // Stable, so the memoised chart can take them without redrawing.
  const toggleSelected = useCallback((indices: number[], on: boolean) => {
    setSelected((s) => {
      const next = new Set(s);
      for (const i of indices) {
        if (on) next.add(i);
        else next.delete(i);
      }
      return next;
    });
  }, []);
  const flipSelected = useCallback((index: number) => {
    setSelected((s) => {
      const next = new Set(s);
      if (!next.delete(index)) next.add(index);
      return next;
    });
  }, []);

  return {
    saved,
    draft,
    excluded,
    selected,
    added,
    removed,
    revise,
    toggleSelected,
    flipSelected,
    clearSelection: () => setSelected(new Set()),
    excludeSelected: (reason: string) => {
      setDraft((d) => new Map([...d, ...[...selected].map((i) => [i, reason] as [number, string])]));
      setSelected(new Set());
    },
    includeSelected: () => {
      setDraft((d) => new Map([...d].filter(([i]) => !selected.has(i))));
      setSelected(new Set());
    },
    discard: () => {
      setDraft(saved);
      revise.reset();
    },
    save: (comment: string) => {
      const exclusions = [...draft].map(([index, reason]) => ({ index, reason })).sort((a, b) => a.index - b.index);
      revise.mutate(comment ? { exclusions, comment } : { exclusions }, { onSuccess: ({ number }) => onRevisionSaved(number) });
    },
  };
}
