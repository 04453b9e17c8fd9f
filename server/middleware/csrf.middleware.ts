import type { RequestHandler } from 'express';
import { AppError } from '../errors/app-error';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function hostOf(url: string): string | null {
  try {
    return new URL(url).host;
  } catch {
    return null;
  }
}

/**
 * State-changing requests must come from our own pages: the Origin (or, without it, the
 * Referer) must name the same host the request was sent to. Works with SameSite=Lax.
 */
export const requireSameOrigin: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  const host = req.headers.host;
  const origin = req.headers.origin;
  const source = origin !== undefined ? origin : req.headers.referer;
  const sourceHost = source ? hostOf(source) : null;
  if (!host || !sourceHost || sourceHost !== host) {
    throw new AppError(
      403,
      'csrf',
      'This request did not come from a Baywright page (Origin header missing or foreign).',
    );
  }
  next();
};
