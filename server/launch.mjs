/**
 * `npm start` entry: the production server from bundled ES modules (server/bundle-launch.mjs):
 * the server and its design-run worker, our TypeScript compiled once rather than on every start,
 * and no source-map work on the stack trace that each database query takes. Rebuilt whenever a
 * source file is newer. `--build` only builds. Without esbuild: server/index.ts under tsx.
 */
import { bundled, importWithLoader } from './bundle-launch.mjs';

const server = bundled({
  name: 'baywright-server',
  entries: { server: 'server/index.ts', 'design.worker': 'server/services/design-runs/design.worker.ts' },
  launcher: 'server/launch.mjs',
  external: true,
  // The design pool starts its worker from the bundle beside it, not through the TypeScript loader.
  define: { __BAYWRIGHT_DESIGN_WORKER__: '"./design.worker.mjs"' },
});
const buildOnly = process.argv[2] === '--build';
const ready = await server.ensure();
if (!buildOnly) {
  if (ready) await import(server.urlOf('server'));
  else await importWithLoader('server/index.ts');
}
