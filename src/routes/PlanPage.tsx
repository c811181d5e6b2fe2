import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router';
import type { Plan } from '../../shared/exports/plan-geometry';
import { apiRequest } from '../api/client';
import { useProject } from '../api/projects';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { PlanDrawing } from '../components/plan/PlanDrawing';

/** The project's survey lines in plan (issue 19 item 1), with the plan's CAD and GIS files. */
export function PlanPage() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  const plan = useQuery({ queryKey: ['plan', projectId], queryFn: ({ signal }) => apiRequest<Plan>(`/api/projects/${encodeURIComponent(projectId)}/plan`, { signal }) });
  if (plan.isPending) return <Loading what="plan" />;
  if (plan.isError) return <LoadError error={plan.error} what="plan" onRetry={() => void plan.refetch()} />;
  const p = plan.data;
  const unmapped = p.lines.filter((l) => l.stations.filter((s) => s.easting !== undefined).length < 2);
  const base = `/api/projects/${encodeURIComponent(projectId)}`;
  return (
    <>
      <title>{`Plan · ${p.project} · Timefield`}</title>
      <PageHeader title="Plan of the survey lines" crumbs={[{ label: 'Projects', to: '/' }, { label: project.data?.name ?? 'Project', to: `/projects/${projectId}` }]}>
        <p>{p.crs ? `Eastings and northings in ${p.crs}; grid north up.` : 'The project has no coordinate system yet: lines with station eastings and northings are drawn in their own grid.'}</p>
      </PageHeader>
      {unmapped.length === p.lines.length ? (
        <p className="rounded-lg border border-stone-300 bg-white px-5 py-6" data-testid="plan-empty">
          No line has station coordinates yet. Upload a station table with <code>easting,northing</code> (or <code>lon,lat</code> once the project has a coordinate system) on a line&rsquo;s Stations tab.
        </p>
      ) : (
        <PlanDrawing plan={p} />
      )}
      {unmapped.length > 0 && unmapped.length < p.lines.length && (
        <p className="mt-2 text-sm text-stone-700">
          Not drawn, no station coordinates: {unmapped.map((l, i) => (
            <span key={l.id}>
              {i > 0 && ', '}
              <Link to={`/lines/${l.id}`}>{l.name}</Link>
            </span>
          ))}
          .
        </p>
      )}
      <ul className="mt-4 space-y-1">
        <li>
          <a href={`${base}/plan.dxf`} download className="font-semibold" data-testid="plan-dxf">
            Plan for CAD (DXF)
          </a>{' '}
          <span className="text-sm text-stone-600">– lines, stations, shots, boreholes, north arrow and scale bar, in the project&rsquo;s grid</span>
        </li>
        <li>
          <a href={`${base}/plan.geojson`} download className="font-semibold" data-testid="plan-geojson">
            Plan for GIS (GeoJSON)
          </a>{' '}
          <span className="text-sm text-stone-600">– WGS 84 longitude/latitude</span>
        </li>
      </ul>
      <p className="mt-4 text-sm text-stone-600">Positions are as surveyed and entered; shots and boreholes are placed along the line by their chainage.</p>
    </>
  );
}
