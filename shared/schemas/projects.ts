import { z } from 'zod';

export const PROJECT_ROLES = ['geophysicist', 'field_tech', 'lead', 'client'] as const;
export const PROJECT_STATUSES = ['active', 'on_hold', 'closed'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];
export type ProjectStatus = (typeof PROJECT_STATUSES)[number];

const text = (max: number) => z.string().trim().min(1, 'is required').max(max);

export const createProjectBody = z.strictObject({
  name: text(160),
  site: text(160),
  clientOrganisation: text(160),
  status: z.enum(PROJECT_STATUSES).optional().default('active'),
});

export const addMemberBody = z.strictObject({
  userId: z.uuid('must be an account id'),
  role: z.enum(PROJECT_ROLES),
});

/** PATCH /api/projects/:projectId/members/:userId: a member's new role in the project. */
export const changeMemberRoleBody = z.strictObject({
  role: z.enum(PROJECT_ROLES, { error: `role must be one of ${PROJECT_ROLES.join(', ')}` }),
});

export const createLineBody = z.strictObject({
  name: text(120),
  notes: z.string().max(4000).optional().default(''),
});

export type CreateProjectBody = z.infer<typeof createProjectBody>;
export type AddMemberBody = z.infer<typeof addMemberBody>;
export type ChangeMemberRoleBody = z.infer<typeof changeMemberRoleBody>;
export type CreateLineBody = z.infer<typeof createLineBody>;
