import type { RequestHandler } from 'express';
import type { AppContext } from '../app-context';
import { countAttemptFromIp } from '../services/session.service';

/** Counts the request against the per-IP one-time-link limit (429 with Retry-After above it). */
export function limitTokenUsePerIp(ctx: AppContext): RequestHandler {
  return (req, _res, next) => {
    countAttemptFromIp(ctx, req.ip ?? 'unknown', ctx.limiters.perIpTokenUses);
    next();
  };
}
