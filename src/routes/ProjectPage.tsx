import type { ReactNode } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import { useProject } from '../api/projects';
import type { Me, ProjectDetail } from '../api/types';
import { Disclosure } from '../components/Disclosure';
import { EmptyState } from '../components/EmptyState';
import { AddMemberForm } from '../components/forms/AddMemberForm';
import { NewLineForm } from '../components/forms/NewLineForm';
import { ProjectColoursForm } from '../components/forms/ProjectColoursForm';
import { ProjectCrsForm } from '../components/forms/ProjectCrsForm';
import { LinesTable } from '../components/LinesTable';
import { Loading, LoadError } from '../components/LoadState';
import { MembersTable } from '../components/MembersTable';
import { PageHeader } from '../components/PageHeader';
import { Panel } from '../components/Panel';
import { ReportsSection } from '../components/reports/ReportsSection';
import { Section } from '../components/Section';
import { StatusBadge } from '../components/StatusBadge';
import { useSignedInUser } from '../components/meContext';
import { formatDate, ROLE_LABELS } from '../lib/format';
import { canCreateLine, canEditProject, canManageMembers, canSeeLines, isAdmin } from '../lib/permissions';

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-sm text-stone-600">{term}</dt>
      <dd className="font-semibold text-stone-900">{children}</dd>
    </div>
  );
}

function LinesSection({ me, project }: { me: Me; project: ProjectDetail }) {
  const navigate = useNavigate();
  if (!canSeeLines(me, project)) {
    return (
      <Section title="Survey lines">
        <EmptyState title="Survey data stays with the project team" testId="lines-hidden">
          Reports the project lead shares with you will be listed on this page.
        </EmptyState>
      </Section>
    );
  }
  const creator = canCreateLine(project);
  return (
    <Section title="Survey lines" description="Each line holds its station geometry, pick sets, velocity models and runs.">
      {creator && (
        <div className="mb-4">
          <Disclosure label="New line" testId="new-line-toggle">
            {() => (
              <Panel title="New survey line">
                <NewLineForm projectId={project.id} onCreated={(line) => navigate(`/lines/${line.id}`)} />
              </Panel>
            )}
          </Disclosure>
        </div>
      )}
      {project.lines.length > 0 ? (
        <LinesTable lines={project.lines} />
      ) : (
        <EmptyState title="No survey lines yet" testId="lines-empty">
          {creator ? 'Create the first line with “New line”.' : 'A geophysicist, field technician or the project lead can add one.'}
        </EmptyState>
      )}
    </Section>
  );
}

function MembersSection({ me, project }: { me: Me; project: ProjectDetail }) {
  const manage = canManageMembers(me, project);
  return (
    <Section title="Members" description="Who works on this project, and in which role.">
      {project.members.length > 0 ? (
        <MembersTable projectId={project.id} members={project.members} canManage={manage} myId={me.id} />
      ) : (
        <EmptyState title="No members yet" testId="members-empty" />
      )}
      {manage && (
        <Panel title="Add a member">
          <AddMemberForm projectId={project.id} members={project.members} />
        </Panel>
      )}
    </Section>
  );
}

export function ProjectPage() {
  const { projectId = '' } = useParams();
  const me = useSignedInUser();
  const project = useProject(projectId);

  if (project.isPending) return <Loading what="project" />;
  if (project.isError) return <LoadError error={project.error} what="project" onRetry={() => void project.refetch()} />;

  const p = project.data;
  return (
    <>
      <title>{`${p.name} · Timefield`}</title>
      <PageHeader title={p.name} crumbs={[{ label: 'Projects', to: '/' }]}>
        <dl data-testid="project-facts" className="flex flex-wrap gap-x-10 gap-y-3">
          <Fact term="Site">{p.site}</Fact>
          <Fact term="Client organisation">{p.clientOrganisation}</Fact>
          <Fact term="Status">
            <StatusBadge status={p.status} />
          </Fact>
          <Fact term="My role">{p.myRole ? ROLE_LABELS[p.myRole] : 'Administrator (not a member)'}</Fact>
          <Fact term="Created">{formatDate(p.createdAt)}</Fact>
        </dl>
        {(isAdmin(me) || p.myRole === 'lead') && (
          <p className="mt-3">
            <Link to={`/projects/${p.id}/audit`} className="font-semibold" data-testid="audit-link">
              Audit trail
            </Link>{' '}
            <span className="text-stone-600">– every change on this project, who made it and when</span>
          </p>
        )}
      </PageHeader>
      {/* A client sees shared reports first; survey data is not theirs to see. */}
      {p.myRole === 'client' ? (
        <ReportsSection project={p} />
      ) : (
        <>
          <LinesSection me={me} project={p} />
          <ReportsSection project={p} />
          <Section
            title="Velocity colours"
            description="One colour scale for every velocity section of this project (models, runs, inversions, reports), so the same colour always means the same velocity. A viewer can stretch it over one section on that page."
          >
            <ProjectColoursForm project={p} canEdit={canEditProject(me, p)} />
          </Section>
          <Section title="Coordinates" description="The map grid the stations' eastings and northings are in, for the plan view and the CAD and GIS exports.">
            <ProjectCrsForm project={p} canEdit={canEditProject(me, p)} />
            <p className="mt-3">
              <Link to={`/projects/${p.id}/plan`} className="font-semibold" data-testid="plan-link">
                Plan of the lines
              </Link>{' '}
              <span className="text-stone-600">– stations, shots and boreholes on a map grid, with CAD and GIS files</span>
            </p>
          </Section>
        </>
      )}
      <MembersSection me={me} project={p} />
    </>
  );
}
