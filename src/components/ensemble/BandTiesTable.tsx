import { useBoreholes } from '../../api/boreholes';
import type { EnsembleSectionView } from '../../../shared/schemas/ensembles';
import { bandTies, type BandTie } from '../../../shared/uncertainty/band-ties';
import { rockWords } from '../../../shared/uncertainty/wording';
import { DataTable, Td, Th, Tr } from '../Table';

const VERDICT: Record<BandTie['verdict'], string> = {
  inside: 'inside the band',
  shallower: 'shallower than the band',
  deeper: 'deeper than the band',
  'no band': 'no band here',
};

/** The logged top of rock at the line's holes against the band: the calibration check of v*. */
export function BandTiesTable({ lineId, section }: { lineId: string; section: EnsembleSectionView }) {
  const holes = useBoreholes(lineId);
  if (!holes.data) return null;
  const ties = bandTies(section.bands, holes.data);
  if (!ties.length) {
    return <p className="mt-4 text-stone-700" data-testid="band-ties-none">No hole on this line logs a top of rock, so the band cannot be checked against one. A borehole or trial pit that reaches rock is the way to calibrate v*.</p>;
  }
  const inside = ties.filter((t) => t.verdict === 'inside').length;
  const judged = ties.filter((t) => t.verdict !== 'no band').length;
  return (
    <div className="mt-6" data-testid="band-ties">
      <h3 className="mb-1 text-lg font-semibold">Band at the holes</h3>
      <p className="mb-2 max-w-prose text-stone-700">
        The logged top of rock lies inside the band of {rockWords(section.rockVelocity)} at {inside} of {judged} holes where the band exists. Outside it, the rock
        velocity chosen (or the model) does not match the ground there: calibrate v* against the logs before reading depths elsewhere.
      </p>
      <DataTable caption="Logged top of rock against the ensemble's depth band" testId="band-ties-table" minWidth="34rem">
        <thead>
          <tr>
            <Th>Hole</Th>
            <Th numeric>x (m)</Th>
            <Th numeric>Logged top of rock (m)</Th>
            <Th numeric>Band (m)</Th>
            <Th>Logged rock is</Th>
          </tr>
        </thead>
        <tbody>
          {ties.map((t) => (
            <Tr key={`${t.name}-${t.x}`}>
              <Td>{t.name}</Td>
              <Td numeric>{t.x.toFixed(1)}</Td>
              <Td numeric>{t.logged.toFixed(1)}</Td>
              <Td numeric>{t.band ? `${t.band.p5.toFixed(1)}–${t.band.p95.toFixed(1)}` : '—'}</Td>
              <Td className={t.verdict === 'inside' ? 'text-emerald-800' : t.verdict === 'no band' ? 'text-stone-600' : 'font-semibold text-amber-800'}>{VERDICT[t.verdict]}</Td>
            </Tr>
          ))}
        </tbody>
      </DataTable>
    </div>
  );
}
