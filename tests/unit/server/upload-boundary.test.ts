import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

// Every multipart upload goes through server/middleware/upload.middleware.ts, whose only entry
// (receiveCheckedUpload) takes a content check: no other server file may read multipart bodies.

function serverFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? serverFiles(path) : path.endsWith('.ts') ? [path] : [];
  });
}

describe('upload boundary', () => {
  it('when the server code is scanned, then multer (the multipart reader) is imported only by the upload middleware', () => {
    const importers = serverFiles('server')
      .filter((file) => /from ['"]multer['"]|require\(['"]multer['"]\)/.test(readFileSync(file, 'utf8')))
      .map((file) => relative('.', file));
    expect(importers).toEqual(['server/middleware/upload.middleware.ts']);
  });

  it('when a route receives an upload, then it names a content check (receiveCheckedUpload with a rule)', () => {
    const callers = serverFiles('server/routes').filter((file) => readFileSync(file, 'utf8').includes('receiveCheckedUpload('));
    expect(callers.length).toBeGreaterThan(0);
    for (const file of callers) {
      const text = readFileSync(file, 'utf8');
      for (const call of text.matchAll(/receiveCheckedUpload\(req, res, (\w+)\)/g)) {
        expect(text, `${file}: ${call[1]} has a check`).toMatch(new RegExp(`const ${call[1]}[^;]*check:`, 's'));
      }
    }
  });
});
