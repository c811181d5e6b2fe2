/**
 * Password reset by one-time link (issue 17 item 3). An administrator starts it for an account; the
 * owner gets a link by e-mail (the local mail sink in development) and sets a new password there.
 * Only the SHA-256 of the link's token is stored; the link works once, within 24 hours, and a newer
 * link for the same account replaces older ones. Setting the password ends every session of the
 * account. Administrators never see or choose the new password.
 */
import { createHash, randomBytes } from 'node:crypto';
import type { FinishPasswordResetBody } from '../../shared/schemas/accounts';
import { endSessionsOf } from '../auth/endSessions';
import { hashingBacklogFull, hashPassword } from '../auth/password';
import { assertStrongPassword } from '../auth/passwordStrength';
import { config } from '../config';
import { dataSource } from '../db/dataSource';
import { HttpError } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { audit } from './audit';

export const RESET_LINK_HOURS = 24;

const digest = (token: string): string => createHash('sha256').update(token).digest('hex');

/** Starts a reset for `userId` and mails the link; returns where it went and until when it works. */
export async function startPasswordReset(actorId: string, userId: string, mailer: Mailer): Promise<{ sentTo: string; expiresAt: string }> {
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(Date.now() + RESET_LINK_HOURS * 3600_000);
  const user = await dataSource.transaction(async (em) => {
    const [u] = await em.query('SELECT id, name, email, active FROM users WHERE id = $1 FOR UPDATE', [userId]);
    if (!u) throw new HttpError(404, 'user_not_found', 'No such account.');
    if (!u.active) throw new HttpError(409, 'account_inactive', 'This account is deactivated; reactivate it before sending a reset link.');
    // A newer link replaces older ones.
    await em.query('UPDATE password_resets SET used_at = now() WHERE user_id = $1 AND used_at IS NULL', [userId]);
    await em.query('INSERT INTO password_resets (token_hash, user_id, created_by, expires_at) VALUES ($1, $2, $3, $4)', [digest(token), userId, actorId, expiresAt]);
    await audit(em, { actorId, action: 'user.password_reset_sent', objectType: 'user', objectId: userId, detail: { expiresAt: expiresAt.toISOString() } });
    return u as { name: string; email: string };
  });
  // In the fragment, not the query: the token never reaches a server log.
  const link = `${config.publicUrl}/reset-password#token=${token}`;
  try {
    await mailer.send({
      to: [user.email],
      subject: 'Set a new Timefield password',
      text:
        `Hello ${user.name},\n\nan administrator has started a password reset for your Timefield account. ` +
        `Open this link to choose a new password (it works once, within ${RESET_LINK_HOURS} hours):\n\n${link}\n\n` +
        'If you did not expect this, tell your administrator; your current password keeps working until the link is used.\n',
    });
  } catch (err) {
    console.error(`[mail] password reset for ${userId}: ${(err as Error).message}`);
    throw new HttpError(503, 'mail_unavailable', 'The reset link could not be e-mailed just now; nothing else changed. Try again in a moment.');
  }
  return { sentTo: user.email, expiresAt: expiresAt.toISOString() };
}

/** Sets the new password from a one-time link; the link is used up and every session of the account ends. */
export async function finishPasswordReset(body: FinishPasswordResetBody): Promise<void> {
  const invalid = () => new HttpError(400, 'invalid_reset_link', `This link does not work any more: it was used, replaced by a newer one, or is older than ${RESET_LINK_HOURS} hours. Ask your administrator for a new one.`);
  const hash = digest(body.token);
  const [found] = await dataSource.query(
    `SELECT r.user_id, u.name, u.email FROM password_resets r JOIN users u ON u.id = r.user_id
     WHERE r.token_hash = $1 AND r.used_at IS NULL AND r.expires_at > now() AND u.active`,
    [hash],
  );
  if (!found) throw invalid();
  assertStrongPassword(body.newPassword, { name: found.name, email: found.email }, 'newPassword');
  if (hashingBacklogFull()) throw new HttpError(503, 'busy', 'Timefield is busy checking passwords; try again in a moment.');
  const passwordHash = await hashPassword(body.newPassword);
  await dataSource.transaction(async (em) => {
    // Used up exactly once, even if the link is submitted twice at the same moment.
    const [, used] = await em.query('UPDATE password_resets SET used_at = now() WHERE token_hash = $1 AND used_at IS NULL AND expires_at > now()', [hash]);
    if (!used) throw invalid();
    await em.query('UPDATE users SET password_hash = $2 WHERE id = $1', [found.user_id, passwordHash]);
    const sessionsEnded = await endSessionsOf(em, found.user_id);
    await audit(em, { actorId: found.user_id, action: 'user.password_reset', objectType: 'user', objectId: found.user_id, detail: { sessionsEnded } });
  });
}
