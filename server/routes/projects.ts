import { Router } from 'express';
import { addMemberBody, changeMemberRoleBody, createLineBody, createProjectBody, updateProjectBody } from '../../shared/schemas/projects';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { isUuid, projectFromParam } from '../policies/scopes';
import { HttpError } from '../http/errors';
import { presentLine, presentProject } from '../presenters/project';
import * as projects from '../services/projects';
import { searchCrs } from '../geo/crs';

export function projectsRouter(): Router {
  const r = Router();

  r.get('/projects', authorize('projects.list'), async (req, res) => {
    const rows = await projects.listProjectsFor(req.user!);
    res.json(rows.map(({ project, role }) => presentProject(project, role)));
  });

  r.post('/projects', authorize('projects.create'), async (req, res) => {
    const { project, role } = await projects.createProject(req.user!, parse(createProjectBody, req.body));
    res.status(201).json(presentProject(project, role));
  });

  // Coordinate reference systems a project can use (projected, metres), by EPSG code or words of the name.
  r.get('/crs', authorize('crs.search'), (req, res) => {
    const q = typeof req.query.q === 'string' ? req.query.q.slice(0, 80) : '';
    res.json(searchCrs(q).map((c) => ({ code: c.code, name: c.name, area: c.area, lonLat: c.noDatumShift === null })));
  });

  r.get('/projects/:projectId', authorize('project.read', projectFromParam), async (req, res) => {
    const { projectId, role } = req.access!;
    const [project, members, lines] = await Promise.all([
      projects.getProject(projectId),
      projects.listMembers(projectId),
      // A client sees the project and its people, not the field data.
      role === 'client' ? Promise.resolve([]) : projects.listLines(projectId),
    ]);
    res.json({ ...presentProject(project, role), lines: lines.map(presentLine), members });
  });

  r.patch('/projects/:projectId', authorize('project.update', projectFromParam), async (req, res) => {
    const { projectId, role } = req.access!;
    const project = await projects.updateProject(req.user!.id, projectId, parse(updateProjectBody, req.body));
    res.json(presentProject(project, role));
  });

  r.post('/projects/:projectId/members', authorize('project.members.add', projectFromParam), async (req, res) => {
    const member = await projects.addMember(req.user!.id, req.access!.projectId, parse(addMemberBody, req.body));
    res.status(201).json(member);
  });

  r.delete('/projects/:projectId/members/:userId', authorize('project.members.remove', projectFromParam), async (req, res) => {
    const userId = req.params.userId as string;
    if (!isUuid(userId)) throw new HttpError(404, 'member_not_found', 'That account is not a member of this project.');
    await projects.removeMember(req.user!.id, req.access!.projectId, userId);
    res.status(204).end();
  });

  r.patch('/projects/:projectId/members/:userId', authorize('project.members.update', projectFromParam), async (req, res) => {
    const userId = req.params.userId as string;
    if (!isUuid(userId)) throw new HttpError(404, 'member_not_found', 'That account is not a member of this project.');
    res.json(await projects.changeMemberRole(req.user!.id, req.access!.projectId, userId, parse(changeMemberRoleBody, req.body)));
  });

  r.post('/projects/:projectId/lines', authorize('project.lines.create', projectFromParam), async (req, res) => {
    const line = await projects.createLine(req.user!.id, req.access!.projectId, parse(createLineBody, req.body));
    res.status(201).json(presentLine(line));
  });

  return r;
}
