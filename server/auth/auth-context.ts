import type { Role } from './policy';

/** Who is calling, set on res.locals.auth by the session middleware. */
export interface AuthContext {
  sessionId: string;
  userId: string;
  email: string;
  name: string;
  firmId: string;
  role: Role;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      auth?: AuthContext;
    }
  }
}
