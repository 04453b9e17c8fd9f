import type { RequestHandler, Response } from 'express';
import type { AppContext } from '../app-context';
import { AppError } from '../errors/app-error';
import { authenticateSession } from '../services/session.service';
import type { AuthContext } from './auth-context';
import { can, type Action } from './policy';

/** Reads the session cookie; a forged, expired or orphaned one is cleared and ignored. */
export function loadSession(ctx: AppContext): RequestHandler {
  return async (req, res, next) => {
    const sessionId = ctx.lucia.readSessionCookie(req.headers.cookie ?? '');
    if (!sessionId) return next();
    const result = await authenticateSession(ctx, sessionId);
    if (!result.auth) {
      res.append('Set-Cookie', ctx.lucia.createBlankSessionCookie().serialize());
      return next();
    }
    if (result.refreshed) {
      res.append('Set-Cookie', ctx.lucia.createSessionCookie(sessionId).serialize());
    }
    res.locals.auth = result.auth;
    next();
  };
}

export function authOf(res: Response): AuthContext {
  const auth = res.locals.auth;
  if (!auth) throw AppError.unauthenticated();
  return auth;
}

/** 401 unless signed in. */
export const requireAuth: RequestHandler = (_req, res, next) => {
  authOf(res);
  next();
};

/** 401 unless signed in, 403 unless the caller's role may perform action (policy.ts). */
export function requireRole(action: Action): RequestHandler {
  return (_req, res, next) => {
    const auth = authOf(res);
    if (!can(auth.role, action)) throw AppError.forbidden();
    next();
  };
}
