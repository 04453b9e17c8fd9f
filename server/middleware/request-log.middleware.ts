import type { RequestHandler } from 'express';
import morgan from 'morgan';
import type { NodeEnv } from '../config';

/** Access log: silent in tests, compact in development, combined format in production. */
export function requestLog(nodeEnv: NodeEnv): RequestHandler {
  if (nodeEnv === 'test') return (_req, _res, next) => next();
  return morgan(nodeEnv === 'production' ? 'combined' : 'dev');
}
