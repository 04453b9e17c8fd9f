import { Lucia, TimeSpan } from 'lucia';
import type { Models } from '../models/models';
import { SequelizeSessionAdapter } from './session-adapter';

export const SESSION_COOKIE_NAME = 'baywright_session';

export function createLucia(models: Models, options: { cookieSecure: boolean }) {
  return new Lucia(new SequelizeSessionAdapter(models), {
    // Sliding expiry: Lucia extends a session used in its second half.
    sessionExpiresIn: new TimeSpan(14, 'd'),
    sessionCookie: {
      name: SESSION_COOKIE_NAME,
      // Lucia always sets HttpOnly and Path=/.
      attributes: { secure: options.cookieSecure, sameSite: 'lax' },
    },
    getUserAttributes: (attributes) => ({ email: attributes.email, name: attributes.name }),
    getSessionAttributes: (attributes) => ({ firmId: attributes.firmId }),
  });
}

export type AppLucia = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: AppLucia;
    DatabaseUserAttributes: { email: string; name: string };
    DatabaseSessionAttributes: { firmId: string };
  }
}
