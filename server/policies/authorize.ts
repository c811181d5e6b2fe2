import type { RequestHandler } from 'express';
import type { ProjectRole } from '../../shared/schemas/projects';
import { dataSource } from '../db/dataSource';
import { HttpError } from '../http/errors';
import { policyTable, type Action } from './table';
import type { ProjectScope } from './scopes';

declare global {
  namespace Express {
    interface Request {
      /** Set by authorize(): the project the object belongs to and the caller's role in it. */
      access?: { projectId: string; role: ProjectRole | null };
    }
  }
}

/** Marks the middleware so the route-coverage test can find which action guards each route. */
export type PolicyMiddleware = RequestHandler & { policyAction: Action };

export const notSignedIn = () => new HttpError(401, 'not_signed_in', 'Please sign in.');
const forbidden = () => new HttpError(403, 'forbidden', 'Your role does not allow this.');
// Outsiders get the same answer for an object that exists and one that does not.
const hidden = () => new HttpError(404, 'not_found', 'Not found.');

export async function projectRoleOf(userId: string, projectId: string): Promise<ProjectRole | null> {
  const rows = await dataSource.query('SELECT role FROM project_members WHERE user_id = $1 AND project_id = $2', [userId, projectId]);
  return rows[0]?.role ?? null;
}

export async function leadsAnyProject(userId: string): Promise<boolean> {
  const rows = await dataSource.query(`SELECT 1 FROM project_members WHERE user_id = $1 AND role = 'lead' LIMIT 1`, [userId]);
  return rows.length > 0;
}

/** Guards a route with one action of the policy table; `scope` ties the object to its project. */
export function authorize(action: Action, scope?: ProjectScope): PolicyMiddleware {
  const rule = policyTable[action];
  const mw: RequestHandler = async (req, _res, next) => {
    try {
      if (rule === 'anyone') return next();
      const user = req.user;
      if (!user) throw notSignedIn();
      if (rule === 'signed_in') return next();
      const isAdmin = user.globalRole === 'admin';
      const roles: readonly ProjectRole[] = 'roles' in rule ? rule.roles : [];
      const adminAllowed = 'admin' in rule && rule.admin === true && isAdmin;

      if (scope) {
        const projectId = await scope(req);
        if (!projectId) throw hidden();
        const role = await projectRoleOf(user.id, projectId);
        if (!role && !isAdmin) throw hidden();
        if (!adminAllowed && !(role && roles.includes(role))) throw forbidden();
        req.access = { projectId, role };
        return next();
      }
      if (adminAllowed) return next();
      if ('leadAnywhere' in rule && rule.leadAnywhere && (await leadsAnyProject(user.id))) return next();
      throw forbidden();
    } catch (err) {
      next(err);
    }
  };
  return Object.assign(mw, { policyAction: action });
}

/** The same table, asked inside a handler: may this role in the project do `action`? */
export function allows(action: Action, role: ProjectRole | null, isAdmin = false): boolean {
  const rule = policyTable[action];
  if (rule === 'anyone' || rule === 'signed_in') return true;
  if ('admin' in rule && rule.admin && isAdmin) return true;
  return 'roles' in rule && role !== null && (rule.roles as readonly ProjectRole[]).includes(role);
}
