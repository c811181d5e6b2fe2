/**
 * The shots the preview can use: from one of the line's pick sets (newest first by default),
 * placed on the current draft. Also the misfit of the shown shot against its picks.
 */
import { useMemo, useState } from 'react';
import type { RasterModel } from '../../../shared/model';
import { usePickSet } from '../../api/picksets';
import type { PickSetSummary } from '../../api/types';
import { pickFromRow, placePreviewShot, shotMisfitMs, type PreviewShot } from './previewShots';
import type { PreviewState } from './usePreview';

export function usePreviewShots(pickSets: PickSetSummary[], raster: RasterModel | null) {
  const [pickSetId, setPickSetId] = useState<string | null>(pickSets[0]?.id ?? null);
  const [shotId, setShotId] = useState<string | null>(null);
  const pickSet = usePickSet(pickSetId, null);
  const rows = pickSet.data?.picks;
  const picks = useMemo(() => (rows ?? []).map(pickFromRow), [rows]);
  const excluded = useMemo(() => new Set((rows ?? []).filter((r) => r.excluded).map((r) => r.line)), [rows]);
  const shots = useMemo(
    () => (pickSet.data?.shots ?? []).map((s) => ({ id: s.shotId, x: s.sourceX, z: s.sourceZ ?? (raster ? raster.surfaceZ(s.sourceX) : 0) })),
    [pickSet.data, raster],
  );
  const placed: PreviewShot | null = useMemo(() => (raster && shotId ? placePreviewShot(raster, picks, shotId) : null), [raster, picks, shotId]);

  return {
    pickSetId,
    setPickSetId: (id: string) => {
      setPickSetId(id);
      setShotId(null);
    },
    shotId,
    setShotId,
    shots,
    loading: Boolean(pickSetId) && pickSet.isPending,
    placed,
    misfit: (state: PreviewState) =>
      placed?.ok && state.field && state.field.receiverTimes.length === placed.shot.picks.length ? shotMisfitMs(placed.shot, state.field.receiverTimes, excluded) : null,
  };
}
