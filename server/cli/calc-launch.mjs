/**
 * `npm run calc` entry: runs the command line from one bundled ES module (esbuild) instead of
 * compiling TypeScript on every start. The bundle lives in node_modules/.cache (never committed)
 * and is rebuilt on demand whenever a source file it was built from is newer or gone, so an edit
 * to the engine is always in the next run. `--build` (the `prepare` script) only builds.
 * Without esbuild it falls back to the TypeScript loader (tsx), which is slower but the same code.
 */
import { mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const entry = join(root, 'server/cli/calc.ts');
const outDir = join(root, 'node_modules/.cache/baywright-calc');
const bundle = join(outDir, 'calc.mjs');
const manifest = join(outDir, 'inputs.json');

/** Whether the bundle is older than any file it was built from (or any of them is gone). */
function stale() {
  let built;
  try {
    built = statSync(bundle).mtimeMs;
    const { inputs } = JSON.parse(readFileSync(manifest, 'utf8'));
    for (const f of inputs) if (statSync(join(root, f)).mtimeMs > built) return true;
    return false;
  } catch {
    return true;
  }
}

async function build() {
  const esbuild = await import('esbuild');
  mkdirSync(outDir, { recursive: true });
  const tmp = `${bundle}.${process.pid}.tmp`;
  const result = await esbuild.build({
    entryPoints: [entry],
    outfile: tmp,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    metafile: true,
    logLevel: 'error',
    absWorkingDir: root,
    // CommonJS dependencies bundled into an ES module call require().
    banner: { js: "import { createRequire as __bwCreateRequire } from 'node:module'; const require = __bwCreateRequire(import.meta.url);" },
  });
  const inputs = Object.keys(result.metafile.inputs).filter((f) => !f.startsWith('node_modules/'));
  inputs.push('package-lock.json', 'tsconfig.json', 'server/cli/calc-launch.mjs');
  // Rename into place so a concurrent run never reads half a bundle.
  writeFileSync(`${manifest}.${process.pid}.tmp`, JSON.stringify({ inputs }));
  renameSync(`${manifest}.${process.pid}.tmp`, manifest);
  renameSync(tmp, bundle);
}

const buildOnly = process.argv[2] === '--build';
let ready = !stale();
if (!ready) {
  try {
    await build();
    ready = true;
  } catch (e) {
    process.stderr.write(`calc: could not bundle the command line (${e instanceof Error ? e.message : String(e)}); using the TypeScript loader\n`);
  }
}
if (!buildOnly) {
  if (ready) await import(pathToFileURL(bundle).href);
  else {
    const { register } = await import('tsx/esm/api');
    register();
    await import(pathToFileURL(entry).href);
  }
}
