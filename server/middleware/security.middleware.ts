import type { RequestHandler } from 'express';
import helmet from 'helmet';

// CSP: only our own origin and no inline script (the production build loads its one module
// script from /assets; e2e/security.spec.ts walks the screens and fails on any violation);
// inline styles because React and Konva set style attributes; blob:/data: images for canvas
// snapshots and exports. No upgrade-insecure-requests: TLS is the proxy's job and it would
// break plain-http localhost.
const helmetHeaders = () =>
  helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        baseUri: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        workerSrc: ["'self'", 'blob:'],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        formAction: ["'self'"],
      },
    },
    crossOriginEmbedderPolicy: false,
    // Sent only over HTTPS, below.
    strictTransportSecurity: false,
  });

export const HSTS_MAX_AGE_S = 365 * 24 * 60 * 60;

/**
 * HSTS only when the request came over HTTPS: directly, or through a proxy the app trusts
 * (TRUST_PROXY) that says so in X-Forwarded-Proto. Over plain http the header is meaningless
 * (RFC 6797 §7.2) and would pin a localhost name to HTTPS in the browser.
 */
const hstsOverHttps = (): RequestHandler => {
  const hsts = helmet.strictTransportSecurity({ maxAge: HSTS_MAX_AGE_S, includeSubDomains: true });
  return (req, res, next) => (req.secure ? hsts(req, res, next) : next());
};

export function securityHeaders(): RequestHandler[] {
  return [helmetHeaders(), hstsOverHttps()];
}
