import { dataSource } from '../db/dataSource';
import { User } from '../entities';
import { HttpError } from '../http/errors';
import { hashPassword, verifyPassword } from '../auth/password';
import { assertStrongPassword } from '../auth/passwordStrength';
import { endSessionsOf } from '../auth/endSessions';
import type { ChangePasswordBody, CreateUserBody, UpdateUserBody } from '../../shared/schemas/accounts';
import { audit } from './audit';

export async function createUser(actorId: string | null, body: CreateUserBody): Promise<User> {
  assertStrongPassword(body.password, body);
  const passwordHash = await hashPassword(body.password);
  return dataSource.transaction(async (em) => {
    if (await em.existsBy(User, { email: body.email })) {
      throw new HttpError(409, 'email_taken', `An account with the e-mail ${body.email} already exists.`);
    }
    const user = await em.save(em.create(User, { email: body.email, name: body.name, passwordHash, globalRole: body.globalRole, active: true }));
    await audit(em, { actorId, action: 'user.create', objectType: 'user', objectId: user.id, detail: { email: user.email, globalRole: user.globalRole } });
    return user;
  });
}

/** An administrator's change. A password reset or a deactivation ends every session of the account. */
export async function updateUser(actorId: string, userId: string, body: UpdateUserBody): Promise<User> {
  const before = await dataSource.getRepository(User).findOneBy({ id: userId });
  if (!before) throw new HttpError(404, 'user_not_found', 'No such account.');
  if (body.password) assertStrongPassword(body.password, { email: before.email, name: body.name ?? before.name });
  const passwordHash = body.password ? await hashPassword(body.password) : undefined;
  return dataSource.transaction(async (em) => {
    const user = await em.findOneBy(User, { id: userId });
    if (!user) throw new HttpError(404, 'user_not_found', 'No such account.');
    if (userId === actorId && (body.active === false || body.globalRole === null)) {
      throw new HttpError(409, 'self_lockout', 'You cannot remove your own administrator role or deactivate your own account.');
    }
    if (body.name !== undefined) user.name = body.name;
    if (body.globalRole !== undefined) user.globalRole = body.globalRole;
    if (body.active !== undefined) user.active = body.active;
    if (passwordHash) user.passwordHash = passwordHash;
    await em.save(user);
    const sessionsEnded = passwordHash || body.active === false ? await endSessionsOf(em, user.id) : 0;
    const changed = Object.keys(body).filter((k) => k !== 'password');
    await audit(em, { actorId, action: 'user.update', objectType: 'user', objectId: user.id, detail: { changed, passwordReset: Boolean(passwordHash), sessionsEnded } });
    return user;
  });
}

/**
 * A user's own change: the new password is checked first (no hashing), then `beforeVerify` runs
 * (the route's sign-in limit, so only real guesses at the current password count), then the
 * current password must be right. Their other sessions end; this one stays.
 */
export async function changeOwnPassword(
  user: Express.User,
  currentSid: string,
  body: ChangePasswordBody,
  beforeVerify: () => Promise<void> = async () => {},
): Promise<void> {
  if (body.newPassword === body.currentPassword) {
    throw new HttpError(400, 'validation_failed', 'The new password must differ from the current one.', [{ path: 'newPassword', message: 'must differ from the current password' }]);
  }
  assertStrongPassword(body.newPassword, user, 'newPassword');
  await beforeVerify();
  const stored = await dataSource.getRepository(User).findOneBy({ id: user.id });
  if (!stored || !(await verifyPassword(body.currentPassword, stored.passwordHash))) {
    throw new HttpError(400, 'wrong_current_password', 'The current password is not right.', [{ path: 'currentPassword', message: 'is not right' }]);
  }
  const passwordHash = await hashPassword(body.newPassword);
  await dataSource.transaction(async (em) => {
    await em.update(User, { id: user.id }, { passwordHash });
    const sessionsEnded = await endSessionsOf(em, user.id, currentSid);
    await audit(em, { actorId: user.id, action: 'user.password_change', objectType: 'user', objectId: user.id, detail: { sessionsEnded } });
  });
}

export interface DirectoryEntry {
  id: string;
  name: string;
  email: string;
}

/**
 * Accounts a caller may choose project members from. The admin sees every active account. A lead
 * sees the people of the projects they belong to, plus staff: accounts that are a client on no
 * project (new accounts included, so a lead can add a client the admin has just created).
 * A client of another project is never shown.
 */
export async function directoryFor(user: Express.User): Promise<DirectoryEntry[]> {
  if (user.globalRole === 'admin') {
    return dataSource.query(`SELECT id, name, email FROM users WHERE active ORDER BY name, email`);
  }
  return dataSource.query(
    `SELECT u.id, u.name, u.email FROM users u
      WHERE u.active AND (
        EXISTS (SELECT 1 FROM project_members mine JOIN project_members theirs ON theirs.project_id = mine.project_id
                 WHERE mine.user_id = $1 AND theirs.user_id = u.id)
        OR NOT EXISTS (SELECT 1 FROM project_members c WHERE c.user_id = u.id AND c.role = 'client'))
      ORDER BY u.name, u.email`,
    [user.id],
  );
}
