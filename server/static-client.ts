import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import express, { type Express } from 'express';

export const DEFAULT_CLIENT_DIR = resolve('dist');

export function hasClientBuild(dir: string): boolean {
  return existsSync(join(dir, 'index.html'));
}

/** Runs `vite build` in a child process; resolves true when dist/index.html exists after. */
export function buildClient(dir: string, log: (line: string) => void): Promise<boolean> {
  const viteBin = resolve('node_modules/vite/bin/vite.js');
  if (!existsSync(viteBin)) {
    log(`client: vite not installed (${viteBin}); cannot build the client`);
    return Promise.resolve(false);
  }
  return new Promise((done) => {
    log('client: dist/ missing, running vite build …');
    const child = spawn(process.execPath, [viteBin, 'build', '--outDir', dir], {
      stdio: ['ignore', 'inherit', 'inherit'],
    });
    child.on('error', (err) => {
      log(`client: vite build could not start: ${err.message}`);
      done(false);
    });
    child.on('exit', (code) => {
      if (code !== 0) log(`client: vite build failed (exit ${code})`);
      done(code === 0 && hasClientBuild(dir));
    });
  });
}

/** Serves the built client and answers every other non-/api GET with index.html. */
export function serveClient(app: Express, dir: string): void {
  app.use(
    express.static(dir, {
      index: false,
      setHeaders(res, filePath) {
        // Vite fingerprints files under assets/, so they never change.
        if (filePath.includes(`${join(dir, 'assets')}`)) {
          res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        }
      },
    }),
  );
  const indexHtml = join(dir, 'index.html');
  app.get('/{*splat}', (_req, res) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
}
