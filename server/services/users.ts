import { dataSource } from '../db/dataSource';
import { User } from '../entities';
import { HttpError } from '../http/errors';
import { hashPassword } from '../auth/password';
import type { CreateUserBody, UpdateUserBody } from '../../shared/schemas/accounts';
import { audit } from './audit';

export async function createUser(actorId: string | null, body: CreateUserBody): Promise<User> {
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

export async function updateUser(actorId: string, userId: string, body: UpdateUserBody): Promise<User> {
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
    const changed = Object.keys(body).filter((k) => k !== 'password');
    await audit(em, { actorId, action: 'user.update', objectType: 'user', objectId: user.id, detail: { changed, passwordReset: Boolean(passwordHash) } });
    return user;
  });
}
