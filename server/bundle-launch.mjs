/**
 * Runs a Node entry of ours from bundled ES modules (esbuild) instead of compiling TypeScript on
 * every start and on every stack trace. Used by `npm start` (server/launch.mjs) and `npm run calc`
 * (server/cli/calc-launch.mjs). The bundles live in node_modules/.cache/<name> (never committed)
 * and are rebuilt whenever a source file they were built from is newer or gone, so an edit is
 * always in the next run. Packages stay outside the bundle (their own files, native modules and
 * data are loaded from node_modules as usual); only our own TypeScript is bundled.
 * Without esbuild the caller falls back to the TypeScript loader (tsx): slower, the same code.
 */
import { mkdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

/**
 * @param {{ name: string, entries: Record<string, string>, launcher: string, external?: boolean, define?: Record<string, string> }} spec
 *   entries: output name (without .mjs) → entry path from the repository root.
 *   external: keep packages out of the bundle (the server); the command line bundles them too.
 * @returns {{ ensure: () => Promise<boolean>, urlOf: (name: string) => string }}
 */
export function bundled(spec) {
  const outDir = join(root, 'node_modules/.cache', spec.name);
  const manifest = join(outDir, 'inputs.json');
  const outputs = Object.keys(spec.entries).map((n) => join(outDir, `${n}.mjs`));

  /** Whether a bundle is older than any file it was built from (or any of them is gone). */
  function stale() {
    try {
      const built = Math.min(...outputs.map((f) => statSync(f).mtimeMs));
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
    const tmpDir = join(outDir, `.build-${process.pid}`);
    const result = await esbuild.build({
      entryPoints: Object.entries(spec.entries).map(([out, src]) => ({ out, in: join(root, src) })),
      outdir: tmpDir,
      outExtension: { '.js': '.mjs' },
      bundle: true,
      splitting: false,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      metafile: true,
      logLevel: 'error',
      absWorkingDir: root,
      ...(spec.external ? { packages: 'external' } : {}),
      ...(spec.define ? { define: spec.define } : {}),
      // CommonJS dependencies bundled into an ES module call require().
      banner: { js: "import { createRequire as __bwCreateRequire } from 'node:module'; const require = __bwCreateRequire(import.meta.url);" },
    });
    const inputs = Object.keys(result.metafile.inputs).filter((f) => !f.startsWith('node_modules/'));
    inputs.push('package-lock.json', 'tsconfig.json', 'server/bundle-launch.mjs', spec.launcher);
    // Rename into place so a concurrent run never reads half a bundle.
    writeFileSync(`${manifest}.${process.pid}.tmp`, JSON.stringify({ inputs }));
    for (const out of Object.keys(spec.entries)) renameSync(join(tmpDir, `${out}.mjs`), join(outDir, `${out}.mjs`));
    renameSync(`${manifest}.${process.pid}.tmp`, manifest);
    rmSync(tmpDir, { recursive: true, force: true });
  }

  return {
    /** Builds when stale; false when it cannot (the caller then uses the TypeScript loader). */
    async ensure() {
      if (!stale()) return true;
      try {
        await build();
        return true;
      } catch (e) {
        process.stderr.write(`${spec.name}: could not bundle (${e instanceof Error ? e.message : String(e)}); using the TypeScript loader\n`);
        return false;
      }
    },
    urlOf: (name) => pathToFileURL(join(outDir, `${name}.mjs`)).href,
  };
}

/** Imports a TypeScript entry through tsx's loader (the fallback without a bundle). */
export async function importWithLoader(entry) {
  const { register } = await import('tsx/esm/api');
  register();
  await import(pathToFileURL(join(root, entry)).href);
}
