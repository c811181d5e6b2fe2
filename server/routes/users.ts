import { Router } from 'express';
import { createUserBody, updateUserBody } from '../../shared/schemas/accounts';
import { dataSource } from '../db/dataSource';
import { User } from '../entities';
import { parse } from '../http/parse';
import { authorize } from '../policies/authorize';
import { isUuid } from '../policies/scopes';
import { HttpError } from '../http/errors';
import { presentUser } from '../presenters/user';
import { createUser, directoryFor, updateUser } from '../services/users';
import { startPasswordReset } from '../services/passwordResets';
import type { Mailer } from '../mail/mailer';

export function usersRouter(mailer: Mailer): Router {
  const r = Router();

  r.get('/users', authorize('users.list'), async (_req, res) => {
    const users = await dataSource.getRepository(User).find({ order: { name: 'ASC' } });
    res.json(users.map(presentUser));
  });

  r.post('/users', authorize('users.create'), async (req, res) => {
    const user = await createUser(req.user!.id, parse(createUserBody, req.body));
    res.status(201).json(presentUser(user));
  });

  // Names and e-mails for choosing project members: never another project's clients (see directoryFor).
  r.get('/users/directory', authorize('users.directory'), async (req, res) => {
    const entries = await directoryFor(req.user!);
    res.json(entries.map((u) => ({ id: u.id, name: u.name, email: u.email })));
  });

  // A one-time link to set a new password, mailed to the account's owner (services/passwordResets.ts).
  r.post('/users/:userId/password-reset', authorize('users.password_reset'), async (req, res) => {
    const userId = req.params.userId as string;
    if (!isUuid(userId)) throw new HttpError(404, 'user_not_found', 'No such account.');
    res.status(202).json(await startPasswordReset(req.user!.id, userId, mailer));
  });

  r.patch('/users/:userId', authorize('users.update'), async (req, res) => {
    const userId = req.params.userId as string;
    if (!isUuid(userId)) throw new HttpError(404, 'user_not_found', 'No such account.');
    const user = await updateUser(req.user!.id, userId, parse(updateUserBody, req.body));
    res.json(presentUser(user));
  });

  return r;
}
