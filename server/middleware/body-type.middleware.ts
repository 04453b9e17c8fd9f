import type { Request, RequestHandler } from 'express';
import { formatJsonPath, jsonTooDeepAt, MAX_JSON_DEPTH } from '../../shared/schemas/json-depth';
import { AppError } from '../errors/app-error';

const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** The request carries a body (RFC 9112 §6.3: Transfer-Encoding, or a Content-Length above 0). */
const hasBody = (req: Request) => req.headers['transfer-encoding'] !== undefined || Number(req.headers['content-length'] ?? 0) > 0;

/**
 * A write request that carries a body must say it is JSON (or multipart/form-data on the routes
 * that take an upload); anything else is 415, never read as an empty body that an all-optional
 * schema would accept.
 */
export function requireJsonBody(multipartPaths: readonly RegExp[]): RequestHandler {
  return (req, _res, next) => {
    if (!WRITE_METHODS.has(req.method) || !hasBody(req)) return next();
    if (req.is('application/json')) return next();
    if (req.is('multipart/form-data') && multipartPaths.some((p) => p.test(req.path))) return next();
    throw new AppError(415, 'unsupported_media_type', 'Send the request body as JSON (Content-Type: application/json).', {
      fields: { 'content-type': 'Must be application/json' },
    });
  };
}

/** A JSON body nested deeper than MAX_JSON_DEPTH is refused (400 naming where) before any handler walks it. */
export const limitJsonDepth: RequestHandler = (req, _res, next) => {
  const path = req.body !== undefined ? jsonTooDeepAt(req.body) : null;
  if (path) {
    const field = formatJsonPath(path) || 'body';
    throw new AppError(400, 'invalid_input', `Invalid input. ${field}: nested more than ${MAX_JSON_DEPTH} levels deep.`, {
      fields: { [field]: `Nested more than ${MAX_JSON_DEPTH} levels deep` },
    });
  }
  next();
};
