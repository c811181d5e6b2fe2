import { dataSource } from '../db/dataSource';
import { Project, ProjectMember, SurveyLine, User } from '../entities';
import { HttpError } from '../http/errors';
import type { AddMemberBody, ChangeMemberRoleBody, CreateLineBody, CreateProjectBody, ProjectRole, UpdateProjectBody } from '../../shared/schemas/projects';
import type { MemberRow } from '../presenters/project';
import { audit } from './audit';
import { crsByCode, CrsError } from '../geo/crs';

/** A project's CRS must be one Timefield can compute with: 422 with the reason otherwise. */
function checkProjectCrs(code: number): void {
  try {
    const crs = crsByCode(code);
    if (crs.kind !== 'projected') throw new CrsError(`EPSG:${code} (${crs.name}) is geographic (degrees): a project needs a projected grid in metres, such as a UTM zone or a national grid.`);
  } catch (e) {
    if (e instanceof CrsError) throw new HttpError(422, 'unknown_crs', e.message, [{ path: 'crsEpsg', message: e.message }]);
    throw e;
  }
}

/** Projects the user belongs to (all projects for an admin), with the user's role in each. */
export async function listProjectsFor(user: Express.User): Promise<{ project: Project; role: ProjectRole | null }[]> {
  const rows = await dataSource
    .getRepository(Project)
    .createQueryBuilder('p')
    .leftJoin(ProjectMember, 'm', 'm.project_id = p.id AND m.user_id = :uid', { uid: user.id })
    .addSelect('m.role', 'my_role')
    .where(user.globalRole === 'admin' ? '1=1' : 'm.user_id IS NOT NULL')
    .orderBy('p.name', 'ASC')
    .getRawAndEntities();
  return rows.entities.map((project, i) => ({ project, role: (rows.raw[i].my_role as ProjectRole) ?? null }));
}

/** A lead who creates a project leads it; an admin creates it without joining. */
export async function createProject(user: Express.User, body: CreateProjectBody): Promise<{ project: Project; role: ProjectRole | null }> {
  return dataSource.transaction(async (em) => {
    const project = await em.save(em.create(Project, body));
    const role: ProjectRole | null = user.globalRole === 'admin' ? null : 'lead';
    if (role) await em.insert(ProjectMember, { projectId: project.id, userId: user.id, role });
    await audit(em, { actorId: user.id, action: 'project.create', objectType: 'project', objectId: project.id, projectId: project.id, detail: { name: project.name } });
    return { project, role };
  });
}

export async function getProject(id: string): Promise<Project> {
  const project = await dataSource.getRepository(Project).findOneBy({ id });
  if (!project) throw new HttpError(404, 'not_found', 'Not found.');
  return project;
}

/** Changes a project's settings; the audit log keeps what each was before. */
export async function updateProject(actorId: string, projectId: string, body: UpdateProjectBody): Promise<Project> {
  return dataSource.transaction(async (em) => {
    const project = await em.findOne(Project, { where: { id: projectId }, lock: { mode: 'pessimistic_write' } });
    if (!project) throw new HttpError(404, 'not_found', 'Not found.');
    const before = { name: project.name, site: project.site, clientOrganisation: project.clientOrganisation, status: project.status, velocityColours: { min: project.velocityColourMin, max: project.velocityColourMax }, crsEpsg: project.crsEpsg };
    if (body.crsEpsg) checkProjectCrs(body.crsEpsg);
    const { velocityColours, ...plain } = body;
    Object.assign(project, plain);
    if (velocityColours) {
      project.velocityColourMin = velocityColours.min;
      project.velocityColourMax = velocityColours.max;
    }
    await em.save(project);
    const changed = Object.fromEntries(Object.keys(body).map((k) => [k, { from: before[k as keyof typeof before], to: body[k as keyof UpdateProjectBody] }]));
    await audit(em, { actorId, action: 'project.update', objectType: 'project', objectId: projectId, projectId, detail: changed });
    return project;
  });
}

export async function listMembers(projectId: string): Promise<MemberRow[]> {
  return dataSource.query(
    `SELECT u.id AS "userId", u.name, u.email, m.role FROM project_members m JOIN users u ON u.id = m.user_id
     WHERE m.project_id = $1 ORDER BY u.name`,
    [projectId],
  );
}

export async function listLines(projectId: string): Promise<SurveyLine[]> {
  return dataSource.getRepository(SurveyLine).find({ where: { projectId }, order: { name: 'ASC' } });
}

export async function addMember(actorId: string, projectId: string, body: AddMemberBody): Promise<MemberRow> {
  return dataSource.transaction(async (em) => {
    const user = await em.findOneBy(User, { id: body.userId });
    if (!user || !user.active) throw new HttpError(422, 'user_not_found', 'No active account with that id.', [{ path: 'userId', message: 'no active account with that id' }]);
    if (await em.existsBy(ProjectMember, { projectId, userId: body.userId })) {
      throw new HttpError(409, 'already_member', `${user.name} is already a member of this project.`);
    }
    await em.insert(ProjectMember, { projectId, userId: user.id, role: body.role });
    await audit(em, { actorId, action: 'project.member.add', objectType: 'user', objectId: user.id, projectId, detail: { role: body.role } });
    return { userId: user.id, name: user.name, email: user.email, role: body.role };
  });
}

export async function removeMember(actorId: string, projectId: string, userId: string): Promise<void> {
  await dataSource.transaction(async (em) => {
    const member = await em.findOneBy(ProjectMember, { projectId, userId });
    if (!member) throw new HttpError(404, 'member_not_found', 'That account is not a member of this project.');
    if (member.role === 'lead') {
      const leads = await em.countBy(ProjectMember, { projectId, role: 'lead' });
      if (leads === 1) throw new HttpError(409, 'last_lead', 'A project needs at least one lead. Add another lead first.');
    }
    await em.delete(ProjectMember, { projectId, userId });
    await audit(em, { actorId, action: 'project.member.remove', objectType: 'user', objectId: userId, projectId, detail: { role: member.role } });
  });
}

/** A member's role changed in place (no remove and re-add); a project keeps at least one lead. */
export async function changeMemberRole(actorId: string, projectId: string, userId: string, body: ChangeMemberRoleBody): Promise<MemberRow> {
  return dataSource.transaction(async (em) => {
    // Serialise role changes of one project, so two leads cannot each demote the other.
    await em.query(`SELECT 1 FROM projects WHERE id = $1 FOR UPDATE`, [projectId]);
    const member = await em.findOneBy(ProjectMember, { projectId, userId });
    if (!member) throw new HttpError(404, 'member_not_found', 'That account is not a member of this project.');
    const user = await em.findOneByOrFail(User, { id: userId });
    if (member.role === body.role) return { userId, name: user.name, email: user.email, role: member.role };
    if (member.role === 'lead') {
      const leads = await em.countBy(ProjectMember, { projectId, role: 'lead' });
      if (leads === 1) throw new HttpError(409, 'last_lead', 'A project needs at least one lead. Make someone else lead first.');
    }
    await em.update(ProjectMember, { projectId, userId }, { role: body.role });
    await audit(em, { actorId, action: 'project.member.role', objectType: 'user', objectId: userId, projectId, detail: { from: member.role, to: body.role } });
    return { userId, name: user.name, email: user.email, role: body.role };
  });
}

export async function createLine(actorId: string, projectId: string, body: CreateLineBody): Promise<SurveyLine> {
  return dataSource.transaction(async (em) => {
    if (await em.existsBy(SurveyLine, { projectId, name: body.name })) {
      throw new HttpError(409, 'line_exists', `This project already has a line named "${body.name}".`);
    }
    const line = await em.save(em.create(SurveyLine, { projectId, name: body.name, notes: body.notes }));
    await audit(em, { actorId, action: 'line.create', objectType: 'survey_line', objectId: line.id, projectId, detail: { name: line.name } });
    return line;
  });
}
