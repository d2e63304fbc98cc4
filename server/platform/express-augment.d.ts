import type { SessionUser } from './roles';

declare global {
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
    /** The roles the session was issued for, to spot a role change. */
    roleStamp?: string;
  }
}
