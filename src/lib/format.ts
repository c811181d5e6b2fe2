import type { Me, ProjectRole, ProjectStatus } from '../api/types';

export const ROLE_LABELS: Record<ProjectRole, string> = {
  lead: 'Project lead',
  geophysicist: 'Geophysicist',
  field_tech: 'Field technician',
  client: 'Client',
};

export const PROJECT_ROLES: ProjectRole[] = ['lead', 'geophysicist', 'field_tech', 'client'];

export const STATUS_LABELS: Record<ProjectStatus, string> = {
  active: 'Active',
  on_hold: 'On hold',
  closed: 'Closed',
};

export const PROJECT_STATUSES: ProjectStatus[] = ['active', 'on_hold', 'closed'];

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

/** "3 Dec 2025"; an unparseable value is shown as given rather than as "Invalid Date". */
export function formatDate(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : dateFormat.format(d);
}

/** One short line for the top bar, e.g. "Administrator" or "Project lead · Geophysicist". */
export function roleSummary(me: Me): string {
  const parts: string[] = [];
  if (me.globalRole === 'admin') parts.push('Administrator');
  const roles = new Set(me.projectRoles.map((g) => g.role));
  for (const role of Object.keys(ROLE_LABELS) as ProjectRole[]) {
    if (roles.has(role)) parts.push(ROLE_LABELS[role]);
  }
  return parts.length ? parts.join(' · ') : 'No project roles yet';
}

/** "1 project" / "3 projects". */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

