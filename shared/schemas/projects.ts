import { z } from 'zod';
import { VELOCITY_COLOUR_LIMITS } from '../colour/velocity-scale';

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

const { min: LO, max: HI } = VELOCITY_COLOUR_LIMITS;
const colourEnd = (end: string) =>
  z.number({ error: `the ${end} end of the colour range must be a number of m/s` }).min(LO, `the ${end} end of the colour range must be at least ${LO} m/s`).max(HI, `the ${end} end of the colour range must be at most ${HI} m/s`);

/** A project's velocity colour range (m/s): every section of the project is coloured on it by default. */
export const velocityColoursBody = z
  .strictObject({ min: colourEnd('slow'), max: colourEnd('fast') })
  .refine((r) => r.max > r.min, { error: 'the fast end of the colour range must be above the slow end', path: ['max'] });

/** PATCH /api/projects/:projectId: the project's settings; send only what changes. */
export const updateProjectBody = z
  .strictObject({
    name: text(160).optional(),
    site: text(160).optional(),
    clientOrganisation: text(160).optional(),
    status: z.enum(PROJECT_STATUSES, { error: `status must be one of ${PROJECT_STATUSES.join(', ')}` }).optional(),
    velocityColours: velocityColoursBody.optional(),
    /** EPSG code of the project's coordinate reference system (projected, metres); null clears it. */
    crsEpsg: z.number({ error: 'the coordinate reference system must be an EPSG code (a whole number)' }).int('the coordinate reference system must be an EPSG code (a whole number)').positive().max(999_999).nullable().optional(),
  })
  .refine((b) => Object.keys(b).length > 0, { error: 'send at least one setting to change' });

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
export type UpdateProjectBody = z.infer<typeof updateProjectBody>;
export type VelocityColoursBody = z.infer<typeof velocityColoursBody>;
export type AddMemberBody = z.infer<typeof addMemberBody>;
export type ChangeMemberRoleBody = z.infer<typeof changeMemberRoleBody>;
export type CreateLineBody = z.infer<typeof createLineBody>;
