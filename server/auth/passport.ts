import type { Request, Response } from 'express';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { invalidCredentials } from '../errors';
import { User } from '../models';
import { actorFrom } from '../services/actors';
import { verifyCredentials } from '../services/sign-in';
import { SESSION_LOAD } from './session-store';

let configured = false;

/** Registers the e-mail + password strategy and how a session refers to its user (by id). */
export function configurePassport(): typeof passport {
  if (configured) return passport;
  configured = true;
  passport.use(
    new LocalStrategy(
      { usernameField: 'email', passwordField: 'password', session: false },
      (email, password, done) => {
        verifyCredentials(email, password).then(
          (user) => done(null, user ?? false),
          (error: unknown) => done(error),
        );
      },
    ),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser(
    (req: Request, id: string, done: (error: unknown, user?: User | false) => void) => {
      // The session read brought the user and their memberships along (server/auth/session-store.ts).
      const loaded = req.session?.[SESSION_LOAD];
      if (loaded && (loaded.user === null || loaded.user.id === id)) {
        if (!loaded.user) return done(null, false);
        req.actor = actorFrom(loaded.user.id, loaded.memberships);
        const user = User.build(
          {
            ...loaded.user,
            createdAt: new Date(loaded.user.createdAt),
            updatedAt: new Date(loaded.user.updatedAt),
          },
          { isNewRecord: false, raw: true },
        );
        return done(null, user);
      }
      // A deleted user simply ends the session (false), rather than failing the request.
      User.findByPk(id).then((user) => done(null, user ?? false), done);
    },
  );
  return passport;
}

/**
 * Runs the local strategy with a custom callback, so a failed sign-in becomes
 * a JSON 401 instead of passport's redirect.
 */
export function authenticatePassword(req: Request, res: Response): Promise<User> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', { session: false }, (error: unknown, user: User | false) => {
      if (error) reject(error);
      else if (!user) reject(invalidCredentials());
      else resolve(user);
    })(req, res, reject);
  });
}

/** Starts a fresh session for the user (passport regenerates the session id, which defeats fixation). */
export function logIn(req: Request, user: User): Promise<void> {
  return new Promise((resolve, reject) =>
    req.login(user, (error) => (error ? reject(error) : resolve())),
  );
}

export function logOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) =>
    req.logout((error) => {
      if (error) return reject(error);
      req.session.destroy((destroyError) => (destroyError ? reject(destroyError) : resolve()));
    }),
  );
}
