import type { Request, Response } from 'express';
import { GZIP_MIN_BYTES, gzipOf, type JsonBody } from '../services/json-body-cache';

/**
 * Sends a serialised JSON body as `res.json` would (same bytes, same Content-Type) with its
 * validator: 304 when the client already holds it (If-None-Match), the gzip encoding made once
 * when the client accepts it and the body is worth compressing.
 */
export function sendJsonBody(req: Request, res: Response, body: JsonBody): void {
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.setHeader('ETag', body.etag);
  res.setHeader('Vary', 'Accept-Encoding');
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  if (body.bytes.length >= GZIP_MIN_BYTES && req.acceptsEncodings('gzip', 'identity') === 'gzip') {
    res.setHeader('Content-Encoding', 'gzip');
    res.send(gzipOf(body));
    return;
  }
  res.send(body.bytes);
}
