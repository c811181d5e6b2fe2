import type { Me, ProjectRole, ProjectSummary } from '../api/types';

/**
 * What the interface offers each user. The server's policy table is the authority;
 * these only decide which buttons and forms to show, so they mirror it loosely.
 */

export const isAdmin = (me: Me): boolean => me.globalRole === 'admin';

export const canCreateProject = (me: Me): boolean => isAdmin(me) || me.projectRoles.some((g) => g.role === 'lead');

export const canManageMembers = (me: Me, project: ProjectSummary): boolean =>
  isAdmin(me) || project.myRole === 'lead';

/** Project settings (name, status, velocity colour range): as the policy table's project.update. */
export const canEditProject = (me: Me, project: ProjectSummary): boolean => isAdmin(me) || project.myRole === 'lead';

const LINE_CREATORS: ProjectRole[] = ['geophysicist', 'field_tech', 'lead'];
export const canCreateLine = (project: ProjectSummary): boolean =>
  project.myRole !== null && LINE_CREATORS.includes(project.myRole);

/** Clients see projects, not survey data. */
export const canSeeLines = (me: Me, project: ProjectSummary): boolean =>
  isAdmin(me) || (project.myRole !== null && project.myRole !== 'client');

/** Geophysicists start and save inversions; leads and field technicians read them (issue 11). */
export const canRunInversions = (role: ProjectRole | null | undefined): boolean => role === 'geophysicist';

/** Cancelling works as for runs: geophysicists and leads (the server's policy table, inversion.cancel). */
export const canCancelInversions = (role: ProjectRole | null | undefined): boolean => role === 'geophysicist' || role === 'lead';
