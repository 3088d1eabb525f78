import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { AppContext } from '../core/context';
import type { SessionUser } from '../core/route';
import { loadSessionUser, verifyCredentials } from './auth.service';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport puts the deserialized account here.
    interface User extends SessionUser {}
  }
}

/**
 * passport-local checks the e-mail and password; the session stores only the user id (as a string,
 * which the session-cleanup query in users.repository.ts matches). The account is re-read on every
 * request, so a deactivated account is signed out at once.
 */
export function createPassport(app: AppContext): InstanceType<typeof Passport> {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      verifyCredentials(app, email, password).then((user) => done(null, user ?? false), done);
    }),
  );
  passport.serializeUser((user, done) => done(null, String((user as SessionUser).id)));
  passport.deserializeUser((id: string, done) => {
    loadSessionUser(app, Number(id)).then((user) => done(null, user ?? false), done);
  });
  return passport;
}
