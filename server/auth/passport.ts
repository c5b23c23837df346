import type { Request, Response } from 'express';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { invalidCredentials } from '../errors';
import { User } from '../models';
import { verifyCredentials } from '../services/sign-in';

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
  passport.deserializeUser((id: string, done) => {
    // A deleted user simply ends the session (false), rather than failing the request.
    User.findByPk(id).then((user) => done(null, user ?? false), done);
  });
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
