import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { dataSource } from '../db/dataSource';
import { User as UserEntity } from '../entities';
import { decoyHash, verifyPassword } from './password';

declare global {
  namespace Express {
    interface User {
      id: string;
      email: string;
      name: string;
      globalRole: 'admin' | null;
      active: boolean;
      createdAt: Date;
    }
  }
}

const users = () => dataSource.getRepository(UserEntity);

/** Unknown e-mail, wrong password and a deactivated account all fail the same way. */
export async function checkCredentials(email: string, password: string): Promise<UserEntity | null> {
  const user = await users().findOneBy({ email: email.trim().toLowerCase() });
  const ok = await verifyPassword(password, user?.passwordHash ?? (await decoyHash()));
  return ok && user?.active ? user : null;
}

passport.use(
  new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
    checkCredentials(email, password).then((u) => done(null, u ?? false), done);
  }),
);

passport.serializeUser((user, done) => done(null, user.id));

// An account deactivated after sign-in is signed out on its next request.
passport.deserializeUser((id: string, done) => {
  users()
    .findOneBy({ id })
    .then((u) => done(null, u?.active ? u : false), done);
});

export { passport };
