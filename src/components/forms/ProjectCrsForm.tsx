import { useQuery } from '@tanstack/react-query';
import { useDeferredValue, useState } from 'react';
import { apiRequest } from '../../api/client';
import { useUpdateProject } from '../../api/projects';
import type { CrsSummary, ProjectSummary } from '../../api/types';
import { formProblems } from '../../lib/formErrors';
import { Button } from '../Button';
import { TextField } from '../Field';
import { FormAlert } from '../FormAlert';

/**
 * The project's coordinate reference system: an EPSG grid in metres, found by code or by name. Station
 * eastings and northings are in it; exports give them and, where the datum allows, WGS 84 longitude/latitude.
 */
export function ProjectCrsForm({ project, canEdit }: { project: ProjectSummary; canEdit: boolean }) {
  const update = useUpdateProject(project.id);
  const [query, setQuery] = useState('');
  const q = useDeferredValue(query.trim());
  const found = useQuery({
    queryKey: ['crs', q],
    queryFn: ({ signal }) => apiRequest<CrsSummary[]>(`/api/crs?q=${encodeURIComponent(q)}`, { signal }),
    enabled: canEdit && q.length >= 2,
    staleTime: Infinity,
  });
  const problems = formProblems(update.error, ['crsEpsg']);
  const crs = project.crs;
  return (
    <div className="flex flex-col gap-3" data-testid="project-crs">
      <FormAlert problems={problems} />
      <p data-testid="project-crs-current">
        {crs ? (
          <>
            <strong>
              EPSG:{crs.code} {crs.name}
            </strong>
            <span className="block text-sm text-stone-600">Area of use: {crs.area}</span>
            {!crs.lonLat && (
              <span className="block text-sm text-amber-900">
                Its datum shift to WGS 84 needs a grid file Timefield does not carry: longitude/latitude uploads and GeoJSON exports are not available for it.
              </span>
            )}
          </>
        ) : (
          'Not set: the lines are in chainage only. Set a grid to give stations eastings and northings and to export to GIS.'
        )}
      </p>
      {canEdit && (
        <>
          <div className="max-w-md">
            <TextField
              label="Find a coordinate system"
              hint="An EPSG code or words of its name, for example 32633 or “UTM zone 33N”. Grids in metres only."
              value={query}
              onChange={(e) => setQuery(e.target.value)}
              data-testid="crs-search"
            />
          </div>
          {found.data && (
            <ul className="max-w-2xl divide-y divide-stone-200 rounded-md border border-stone-200 bg-white" data-testid="crs-results">
              {found.data.length === 0 && <li className="px-3 py-2 text-stone-600">No grid in metres matches “{q}”.</li>}
              {found.data.map((c) => (
                <li key={c.code} className="flex items-center justify-between gap-3 px-3 py-2">
                  <span>
                    <span className="font-semibold">EPSG:{c.code}</span> {c.name}
                  </span>
                  <Button size="sm" variant="secondary" busy={update.isPending && update.variables?.crsEpsg === c.code} onClick={() => update.mutate({ crsEpsg: c.code }, { onSuccess: () => setQuery('') })} data-testid={`crs-choose-${c.code}`}>
                    Use this one
                  </Button>
                </li>
              ))}
            </ul>
          )}
        </>
      )}
    </div>
  );
}
