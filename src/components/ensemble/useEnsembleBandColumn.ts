import { useMemo } from 'react';
import { useEnsembleSection, useInversionEnsembles } from '../../api/ensembles';
import { rockWords } from '../../../shared/uncertainty/wording';
import type { BandColumn } from '../exports/SectionExports';

/** The newest combined ensemble of an inversion as a depth-to-rock table column, or null when it has none. */
export function useEnsembleBandColumn(inversionId: string): BandColumn | null {
  const list = useInversionEnsembles(inversionId, Boolean(inversionId));
  const newest = list.data?.find((e) => e.status === 'done');
  const section = useEnsembleSection(newest?.id ?? '', Boolean(newest));
  return useMemo(() => {
    if (!newest || !section.data) return null;
    return {
      title: `Ensemble band, ${rockWords(section.data.rockVelocity)} (m)`,
      byStation: new Map(section.data.bands.map((b) => [b.station, { p5: b.p5, p95: b.p95 }])),
    };
  }, [newest, section.data]);
}
