import type { EnsembleSectionView, EnsembleView } from '../../../shared/schemas/ensembles';
import { depthBandCsv, rockWords } from '../../../shared/uncertainty/wording';
import { Button } from '../Button';
import { ScrollTable } from '../line/ScrollTable';
import { downloadText, safeFileName } from '../model/download';
import { Td, Th, Tr } from '../Table';

const m = (v: number | null) => (v === null ? '—' : v.toFixed(1));

/** The depth of v* per station: median and 5–95 % band over the members that resolve it there; a CSV of the same. */
export function DepthBandTable({ section, ensemble, title }: { section: EnsembleSectionView; ensemble: EnsembleView; title: string }) {
  const download = () =>
    downloadText(
      `${safeFileName(title)}.depth-band.csv`,
      depthBandCsv({ title, rock: section.rockVelocity, vary: ensemble.vary, used: section.used, excluded: section.excluded }, section.bands),
      'text/csv',
    );
  return (
    <div>
      <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <p className="text-stone-700">
          Depth below ground of {rockWords(section.rockVelocity)} at each station. A dash: fewer than half the members resolve it there (no rays that deep).
        </p>
        <Button variant="secondary" size="sm" onClick={download} data-testid="download-depth-band">
          Download CSV
        </Button>
      </div>
      <ScrollTable caption={`Depth band of ${rockWords(section.rockVelocity)} per station`} testId="depth-band-table" minWidth="36rem">
        <thead>
          <tr>
            <Th>Station</Th>
            <Th numeric>x (m)</Th>
            <Th numeric>Ground (m)</Th>
            <Th numeric>5 % depth (m)</Th>
            <Th numeric>Median depth (m)</Th>
            <Th numeric>95 % depth (m)</Th>
            <Th numeric>Band (m)</Th>
            <Th numeric>Members</Th>
          </tr>
        </thead>
        <tbody>
          {section.bands.map((b) => (
            <Tr key={`${b.station}-${b.x}`}>
              <Td>{b.station}</Td>
              <Td numeric>{b.x.toFixed(1)}</Td>
              <Td numeric>{b.groundZ.toFixed(1)}</Td>
              <Td numeric>{m(b.p5)}</Td>
              <Td numeric className="font-semibold">{m(b.median)}</Td>
              <Td numeric>{m(b.p95)}</Td>
              <Td numeric>{b.p5 === null || b.p95 === null ? '—' : (b.p95 - b.p5).toFixed(1)}</Td>
              <Td numeric>{b.resolved}</Td>
            </Tr>
          ))}
        </tbody>
      </ScrollTable>
    </div>
  );
}
