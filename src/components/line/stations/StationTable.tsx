import type { Station } from '../../../api/types';
import { Td, Th, Tr } from '../../Table';
import { ScrollTable } from '../ScrollTable';

const metres = (v: number) => v.toLocaleString('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 3 });

/** The saved station table, read-only; easting and northing where the line has them. */
export function StationTable({ stations }: { stations: Station[] }) {
  const located = stations.some((s) => s.easting !== undefined);
  return (
    <ScrollTable caption="Station table" testId="station-table" minWidth="20rem">
      <thead>
        <tr>
          <Th numeric>Station</Th>
          <Th numeric>x (m)</Th>
          <Th numeric>Elevation z (m)</Th>
          {located && <Th numeric>Easting (m)</Th>}
          {located && <Th numeric>Northing (m)</Th>}
        </tr>
      </thead>
      <tbody>
        {stations.map((s) => (
          <Tr key={s.station}>
            <Td numeric>{s.station}</Td>
            <Td numeric>{metres(s.x)}</Td>
            <Td numeric>{metres(s.z)}</Td>
            {located && <Td numeric>{s.easting === undefined ? '—' : metres(s.easting)}</Td>}
            {located && <Td numeric>{s.northing === undefined ? '—' : metres(s.northing)}</Td>}
          </Tr>
        ))}
      </tbody>
    </ScrollTable>
  );
}
