/**
 * `npm run calc` entry: runs the command line from one bundled ES module (server/bundle-launch.mjs)
 * instead of compiling TypeScript on every start; rebuilt on demand whenever a source file it was
 * built from is newer or gone. `--build` (the `prepare` script) only builds.
 */
import v8 from 'node:v8';
import { bundled, importWithLoader } from '../bundle-launch.mjs';
import { CALC_V8_FLAGS } from './calc-v8-flags.mjs';

v8.setFlagsFromString(CALC_V8_FLAGS);

const calc = bundled({ name: 'baywright-calc', entries: { calc: 'server/cli/calc.ts' }, launcher: 'server/cli/calc-launch.mjs' });
const buildOnly = process.argv[2] === '--build';
const ready = await calc.ensure();
if (!buildOnly) {
  if (ready) await import(calc.urlOf('calc'));
  else await importWithLoader('server/cli/calc.ts');
}
