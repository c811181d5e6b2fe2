import { z } from 'zod';

/** Body of PUT /api/organisation: the consultancy's name and postal address as printed on reports. */
export const organisationBody = z.strictObject({
  name: z.string().trim().min(1, 'give the consultancy a name').max(200),
  address: z.string().trim().max(1000).optional().default(''),
});
export type OrganisationBody = z.infer<typeof organisationBody>;

/** Largest logo accepted; a cover logo is printed a few centimetres wide. */
export const MAX_LOGO_BYTES = 512 * 1024;
