import { z } from 'zod';

export const email = z.string().trim().toLowerCase().email('must be an e-mail address').max(254);

export const loginBody = z.strictObject({
  email: z.string().trim().toLowerCase().min(1, 'is required').max(254),
  password: z.string().min(1, 'is required').max(200),
});

/** Length only; the server also refuses easily guessed passwords (server/auth/passwordStrength.ts). */
export const password = z.string().min(10, 'must be at least 10 characters').max(200);
export const globalRole = z.enum(['admin']).nullable();

export const createUserBody = z.strictObject({
  email,
  name: z.string().trim().min(1, 'is required').max(120),
  password,
  globalRole: globalRole.optional().default(null),
});

export const updateUserBody = z
  .strictObject({
    name: z.string().trim().min(1, 'is required').max(120).optional(),
    globalRole: globalRole.optional(),
    active: z.boolean().optional(),
    password: password.optional(),
  })
  .refine((b) => Object.keys(b).length > 0, 'give at least one field to change');

/** A signed-in user's own change; strength is checked on the server (it needs the word lists). */
export const changePasswordBody = z.strictObject({
  currentPassword: z.string().min(1, 'is required').max(200),
  newPassword: password,
});

export type LoginBody = z.infer<typeof loginBody>;
export type CreateUserBody = z.infer<typeof createUserBody>;
export type UpdateUserBody = z.infer<typeof updateUserBody>;
export type ChangePasswordBody = z.infer<typeof changePasswordBody>;

/** POST /api/auth/password-reset: the token from a one-time link and the new password. */
export const finishPasswordResetBody = z.strictObject({
  token: z.string().min(20, 'is not a reset link token').max(200),
  newPassword: password,
});
export type FinishPasswordResetBody = z.infer<typeof finishPasswordResetBody>;
