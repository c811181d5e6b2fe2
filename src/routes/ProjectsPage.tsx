import { Link, useNavigate } from 'react-router';
import { useProjects } from '../api/projects';
import { Disclosure } from '../components/Disclosure';
import { EmptyState } from '../components/EmptyState';
import { NewProjectForm } from '../components/forms/NewProjectForm';
import { Loading, LoadError } from '../components/LoadState';
import { PageHeader } from '../components/PageHeader';
import { Panel } from '../components/Panel';
import { StatusBadge } from '../components/StatusBadge';
import { DataTable, Td, Th, Tr } from '../components/Table';
import { useSignedInUser } from '../components/meContext';
import { formatDate, plural, ROLE_LABELS } from '../lib/format';
import { canCreateProject, isAdmin } from '../lib/permissions';

export function ProjectsPage() {
  const me = useSignedInUser();
  const projects = useProjects();
  const navigate = useNavigate();

  return (
    <>
      <title>Projects · Timefield</title>
      <PageHeader title="Projects">
        {isAdmin(me) ? 'Every project in the organisation.' : 'The projects you are a member of.'}
        {projects.data && ` ${plural(projects.data.length, 'project')}.`}
      </PageHeader>

      {canCreateProject(me) && (
        <div className="mb-8">
          <Disclosure label="New project" testId="new-project-toggle">
            {() => (
              <Panel title="New project">
                <NewProjectForm onCreated={(p) => navigate(`/projects/${p.id}`)} />
              </Panel>
            )}
          </Disclosure>
        </div>
      )}

      {projects.isPending && <Loading what="projects" />}
      {projects.isError && <LoadError error={projects.error} what="project list" onRetry={() => void projects.refetch()} />}
      {projects.data && projects.data.length === 0 && (
        <EmptyState title="No projects yet" testId="projects-empty">
          {canCreateProject(me)
            ? 'Create the first one with “New project”.'
            : 'When a project lead adds you to a project, it will appear here.'}
        </EmptyState>
      )}
      {projects.data && projects.data.length > 0 && (
        <DataTable caption="Projects" testId="projects-table" minWidth="48rem">
          <thead>
            <tr>
              <Th>Project</Th>
              <Th>Site</Th>
              <Th>Client organisation</Th>
              <Th>Status</Th>
              <Th>My role</Th>
              <Th numeric>Created</Th>
            </tr>
          </thead>
          <tbody>
            {projects.data.map((p) => (
              <Tr key={p.id}>
                <Td>
                  <Link to={`/projects/${p.id}`} className="font-semibold">
                    {p.name}
                  </Link>
                </Td>
                <Td>{p.site}</Td>
                <Td>{p.clientOrganisation}</Td>
                <Td>
                  <StatusBadge status={p.status} />
                </Td>
                <Td className="whitespace-nowrap text-stone-700">{p.myRole ? ROLE_LABELS[p.myRole] : <span className="text-stone-500">Not a member</span>}</Td>
                <Td numeric className="whitespace-nowrap text-stone-600">
                  {formatDate(p.createdAt)}
                </Td>
              </Tr>
            ))}
          </tbody>
        </DataTable>
      )}
    </>
  );
}
