import type { ProjectRole } from '../../shared/schemas/projects';

/**
 * The one table of permissions. Every route names an action from it; nothing else decides access.
 *
 * - 'anyone': no sign-in needed.
 * - 'signed_in': any active account.
 * - { admin, roles, leadAnywhere }: allowed for the global admin (admin: true), for members of the
 *   object's project with one of `roles`, or (for actions not tied to one project) for an account
 *   that leads at least one project (leadAnywhere: true).
 */
export type Rule = 'anyone' | 'signed_in' | { admin?: boolean; roles?: readonly ProjectRole[]; leadAnywhere?: boolean };

const MEMBERS = ['geophysicist', 'field_tech', 'lead', 'client'] as const;
const STAFF = ['geophysicist', 'field_tech', 'lead'] as const;

export const policyTable = {
  'health.read': 'anyone',
  'auth.csrf': 'anyone',
  'auth.login': 'anyone',
  'auth.logout': 'signed_in',
  'auth.me': 'signed_in',
  'auth.session': 'anyone',
  'auth.password.change': 'signed_in',
  // Issue 17 item 3: a new password from a one-time link (the link's token is the credential).
  'auth.password.reset': 'anyone',

  'users.list': { admin: true },
  'users.create': { admin: true },
  'users.update': { admin: true },
  'users.password_reset': { admin: true },
  'users.directory': { admin: true, leadAnywhere: true },

  'projects.list': 'signed_in',
  'projects.create': { admin: true, leadAnywhere: true },
  'project.read': { admin: true, roles: MEMBERS },
  // Issue 17 item 6: name, status and the velocity colour range of a project.
  'project.update': { admin: true, roles: ['lead'] },
  // Issue 19: the list of coordinate reference systems (public reference data) for the project form.
  'crs.search': 'signed_in',
  // Issue 19: the plan of the project's lines (staff, as the lines themselves).
  'project.plan': { roles: STAFF },
  'project.members.add': { admin: true, roles: ['lead'] },
  'project.members.remove': { admin: true, roles: ['lead'] },
  'project.members.update': { admin: true, roles: ['lead'] },
  'project.lines.create': { roles: STAFF },

  'line.read': { roles: STAFF },
  'line.stations.write': { roles: ['geophysicist', 'field_tech'] },
  'line.picksets.create': { roles: ['geophysicist', 'field_tech'] },
  // Issue 12 item 7: field technicians and geophysicists upload records; leads read them; clients never see them.
  'line.records.read': { roles: STAFF },
  'line.records.create': { roles: ['geophysicist', 'field_tech'] },
  'record.read': { roles: STAFF },
  'record.update': { roles: ['geophysicist', 'field_tech'] },
  // Issue 13 item 3: boreholes are field data; staff read them, field technicians and geophysicists enter them.
  'line.boreholes.read': { roles: STAFF },
  'line.boreholes.create': { roles: ['geophysicist', 'field_tech'] },
  'borehole.update': { roles: ['geophysicist', 'field_tech'] },

  'line.models.create': { roles: ['geophysicist'] },
  'model.read': { roles: STAFF },
  'model.update': { roles: ['geophysicist'] },

  'runs.create': { roles: ['geophysicist', 'lead'] },
  'run.read': { roles: STAFF },
  'run.cancel': { roles: ['geophysicist', 'lead'] },

  // Issue 11: geophysicists start and save inversions; leads and field technicians read them; leads
  // may also stop one, as they may stop a run (a lead answers for the project's use of the workers).
  'inversions.create': { roles: ['geophysicist'] },
  'inversion.read': { roles: STAFF },
  'inversion.cancel': { roles: ['geophysicist', 'lead'] },
  'inversion.save_model': { roles: ['geophysicist'] },
  // Issue 20: ensembles as inversions; clients see their bands only in a shared report.
  'ensembles.create': { roles: ['geophysicist'] },
  'ensemble.read': { roles: STAFF },
  'ensemble.cancel': { roles: ['geophysicist', 'lead'] },

  'reports.create': { roles: ['geophysicist', 'lead'] },
  // A client reads a report only once it is shared with them (checked with report.read_unshared).
  'report.read': { roles: MEMBERS },
  'report.read_unshared': { roles: STAFF },
  'report.submit': { roles: ['geophysicist'] },
  'report.review': { roles: ['lead'] },
  'report.share': { roles: ['lead'] },
  'project.reports.list': { roles: MEMBERS },
  'project.audit.read': { admin: true, roles: ['lead'] },
  'outbox.read': { admin: true },
  // Name, address and logo print on every report a client receives: nothing in them is secret.
  'organisation.read': 'signed_in',
  'organisation.update': { admin: true },

  'pickset.read': { roles: STAFF },
  'pickset.revise': { roles: ['geophysicist'] },
  // Issue 17 item 5: whoever uploads pick sets may retire a mistaken one (and bring it back).
  'pickset.retire': { roles: ['geophysicist', 'field_tech'] },
} as const satisfies Record<string, Rule>;

export type Action = keyof typeof policyTable;
