import { dataSource } from '../db/dataSource';
import { presentUser } from './user';

/** The signed-in account with its role in each project. */
export async function presentMe(user: Express.User) {
  const projectRoles = await dataSource.query(
    `SELECT p.id AS "projectId", p.name AS "projectName", m.role FROM project_members m
     JOIN projects p ON p.id = m.project_id WHERE m.user_id = $1 ORDER BY p.name`,
    [user.id],
  );
  const { id, email, name, globalRole } = presentUser(user);
  return { id, email, name, globalRole, projectRoles };
}
