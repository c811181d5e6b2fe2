import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { apiRequest } from '../../api/client';
import { DataTable, Td, Th, Tr } from '../Table';

interface DepthTable {
  surface: string;
  interfaces: string[];
  coverage: boolean;
  rows: { station: number | string; x: number; easting: number | null; northing: number | null; groundZ: number; depth: number | null; elevation: number | null; note: string; classes: (number | null)[] }[];
  classes: { from: number; name: string }[];
  ties: { hole: string; x: number; logged: number; material: string; interpreted: number | null; difference: number | null }[];
  cautions: string[];
}

const m = (v: number | null, digits = 2) => (v === null ? '—' : v.toFixed(digits));

/**
 * A section's deliverables (issue 19): the depth-to-rock table on the page, and the files for CAD
 * and GIS — DXF, the gridded section and the depth-to-rock table as CSV, GeoJSON — for the rock
 * surface chosen here (an interface of a layered model or an iso-velocity) and, optionally, the
 * excavatability classes by velocity.
 */
/** An ensemble's 5–95 % depth band beside the table (an inversion with a combined ensemble). */
export interface BandColumn {
  title: string;
  byStation: Map<string, { p5: number | null; p95: number | null }>;
}

export function SectionExports({ base, band, testId = 'section-exports' }: { base: string; band?: BandColumn; testId?: string }) {
  const [rock, setRock] = useState<string>('');
  const [iso, setIso] = useState(2500);
  const [classes, setClasses] = useState(true);
  const params = new URLSearchParams();
  const rockParam = rock === 'iso' ? String(iso) : rock;
  if (rockParam) params.set('rock', rockParam);
  if (!classes) params.set('classes', 'none');
  const qs = params.toString() ? `?${params}` : '';
  const table = useQuery({ queryKey: ['depth-to-rock', base, qs], queryFn: ({ signal }) => apiRequest<DepthTable>(`${base}/depth-to-rock.json${qs}`, { signal }) });
  const data = table.data;
  const hasCoordinates = Boolean(data?.rows.some((r) => r.easting !== null));
  const link = (file: string, label: string, hint: string) => (
    <li>
      <a href={`${base}/${file}${qs}`} download className="font-semibold" data-testid={`export-${file}`}>
        {label}
      </a>{' '}
      <span className="text-sm text-stone-600">– {hint}</span>
    </li>
  );
  return (
    <section aria-label="Depth to rock and exports" data-testid={testId} className="mt-6">
      <h3 className="mb-2 text-lg font-semibold">Depth to rock and exports</h3>
      <div className="mb-3 flex flex-wrap items-end gap-4">
        <label className="flex min-w-0 max-w-full flex-col gap-1 font-semibold text-stone-800">
          Rock surface
          <select value={rock} onChange={(e) => setRock(e.target.value)} className="max-w-full rounded-md border border-stone-300 bg-white px-2 py-1.5 font-normal" data-testid="export-rock">
            <option value="">{data?.interfaces.length ? `Base of ${data.interfaces[data.interfaces.length - 1]} (deepest interface)` : 'Iso-velocity 2500 m/s'}</option>
            {(data?.interfaces ?? []).slice(0, -1).map((name, i) => (
              <option key={name} value={`interface:${i + 1}`}>
                Base of {name}
              </option>
            ))}
            <option value="iso">Iso-velocity…</option>
          </select>
        </label>
        {rock === 'iso' && (
          <label className="flex flex-col gap-1 font-semibold text-stone-800">
            Velocity (m/s)
            <input type="number" min={100} step={100} value={iso} onChange={(e) => Number(e.target.value) >= 50 && setIso(Number(e.target.value))} className="w-28 rounded-md border border-stone-300 px-2 py-1.5 font-normal tabular-nums" data-testid="export-iso" />
          </label>
        )}
        <label className="flex items-center gap-2 pb-2">
          <input type="checkbox" checked={classes} onChange={(e) => setClasses(e.target.checked)} className="accent-accent-700" data-testid="export-classes" />
          Excavatability by velocity (after Weaver 1975)
        </label>
      </div>
      <ul className="mb-4 space-y-1">
        {link('section.dxf', 'Section for CAD (DXF)', 'ground, interfaces, labelled iso-velocity lines, boreholes, stations and shots, title block; metres, true scale')}
        {link('section.csv', 'Gridded section (CSV)', 'every ground node: chainage, easting, northing, elevation, velocity, coverage')}
        {link('depth-to-rock.csv', 'Depth-to-rock table (CSV)', 'the table below, with the depth to each excavatability class')}
        {hasCoordinates ? link('depth-to-rock.geojson', 'Line and depth to rock for GIS (GeoJSON)', 'WGS 84 longitude/latitude') : <li className="text-sm text-stone-600">GeoJSON needs the project’s coordinate system and station eastings and northings.</li>}
      </ul>
      {table.error && <p role="alert" className="text-red-800">The depth-to-rock table could not be read: {(table.error as Error).message}</p>}
      {data && (
        <>
          <p className="mb-2 text-sm text-stone-700">
            Depth below ground of {data.surface} at each station{data.coverage ? ', only where the rays resolve it' : ''} (m).
          </p>
          <DataTable caption="Depth to rock at the stations" testId="depth-to-rock-table" minWidth="36rem">
            <thead>
              <tr>
                <Th>Station</Th>
                <Th numeric>x (m)</Th>
                {hasCoordinates && <Th numeric>Easting</Th>}
                {hasCoordinates && <Th numeric>Northing</Th>}
                <Th numeric>Ground (m)</Th>
                <Th numeric>Depth (m)</Th>
                <Th numeric>Elevation (m)</Th>
                {band && <Th numeric title="The 5–95 % band of the depth over the ensemble's members">{band.title}</Th>}
                {data.classes.map((c) => (
                  <Th key={c.from} numeric title={`Depth where the velocity first reaches ${c.from} m/s`}>
                    {c.name} from (m)
                  </Th>
                ))}
              </tr>
            </thead>
            <tbody>
              {data.rows.map((r) => (
                <Tr key={String(r.station)} testId="depth-to-rock-row">
                  <Td>{r.station}</Td>
                  <Td numeric>{m(r.x)}</Td>
                  {hasCoordinates && <Td numeric>{m(r.easting)}</Td>}
                  {hasCoordinates && <Td numeric>{m(r.northing)}</Td>}
                  <Td numeric>{m(r.groundZ)}</Td>
                  <Td numeric>{r.depth === null ? r.note : m(r.depth)}</Td>
                  <Td numeric>{m(r.elevation)}</Td>
                  {band && <Td numeric>{bandText(band.byStation.get(String(r.station)))}</Td>}
                  {r.classes.map((d, k) => (
                    <Td key={k} numeric>
                      {m(d, 1)}
                    </Td>
                  ))}
                </Tr>
              ))}
            </tbody>
          </DataTable>
          {data.ties.length > 0 && (
            <p className="mt-2 text-sm text-stone-700" data-testid="depth-to-rock-ties">
              At the holes (interpreted − logged):{' '}
              {data.ties.map((t) => `${t.hole} ${t.material} ${t.logged} m: ${t.difference === null ? 'not resolved' : `${t.difference > 0 ? '+' : ''}${t.difference.toFixed(1)} m`}`).join('; ')}.
            </p>
          )}
          <ul className="mt-3 list-disc space-y-1 pl-5 text-sm text-stone-700">
            {data.cautions.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </>
      )}
    </section>
  );
}

const bandText = (b: { p5: number | null; p95: number | null } | undefined) => (b && b.p5 !== null && b.p95 !== null ? `${b.p5.toFixed(1)}–${b.p95.toFixed(1)}` : '—');
