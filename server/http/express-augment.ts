import type { User as UserModel } from '../models/user';
import type { Actor } from '../policies';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport puts the signed-in user here; it is the model instance.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends UserModel {}
    interface Request {
      /** How this request was authenticated, if at all. */
      authMethod?: 'session' | 'token';
      actor?: Actor;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

export {};
