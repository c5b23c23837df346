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
      /** A Bearer token's scope: 'read' tokens may call only operations that change nothing. */
      tokenScope?: 'read' | 'read-write';
      actor?: Actor;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
    /** When the person signed in (ms since the epoch): sessions end SESSION_MAX_HOURS later. */
    signedInAt?: number;
  }
}

export {};
