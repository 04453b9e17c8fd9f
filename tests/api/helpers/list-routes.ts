import type { Express } from 'express';

interface LayerLike {
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
  rawPath?: unknown;
}

function join(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

/**
 * Every "METHOD /path" registered on the app, found by walking Express 5's router stack
 * (mounted routers included). A path that is not a plain string shows up as <non-string>
 * so the coverage test fails rather than skipping it.
 */
export function listRoutes(app: Express): string[] {
  const out: string[] = [];
  const walk = (stack: LayerLike[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const path = typeof layer.route.path === 'string' ? layer.route.path : '<non-string>';
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on) out.push(`${method.toUpperCase()} ${join(prefix, path)}`);
        }
      } else if (layer.handle && Array.isArray(layer.handle.stack)) {
        const path = typeof layer.rawPath === 'string' ? layer.rawPath : '<non-string>';
        walk(layer.handle.stack, join(prefix, path));
      }
    }
  };
  walk((app as unknown as { router: { stack: LayerLike[] } }).router.stack, '');
  return out;
}
