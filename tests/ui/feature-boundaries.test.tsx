import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve, sep } from 'node:path';
import { describe, expect, it } from 'vitest';

// The import rule of the client: a feature never imports another feature; shared pieces
// live in src/components, src/lib or src/config.
const FEATURES_DIR = resolve(__dirname, '../../src/features');

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name);
    return statSync(full).isDirectory() ? filesUnder(full) : /\.tsx?$/.test(name) ? [full] : [];
  });
}

function crossFeatureImports(): string[] {
  const offences: string[] = [];
  for (const file of filesUnder(FEATURES_DIR)) {
    const ownFeature = relative(FEATURES_DIR, file).split(sep)[0];
    const source = readFileSync(file, 'utf8');
    for (const match of source.matchAll(/from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g)) {
      const spec = match[1] ?? match[2];
      if (!spec.startsWith('.')) continue;
      const target = resolve(file, '..', spec);
      const rel = relative(FEATURES_DIR, target);
      if (rel.startsWith('..')) continue;
      const targetFeature = rel.split(sep)[0];
      if (targetFeature !== ownFeature) offences.push(`${relative(FEATURES_DIR, file)} -> ${spec}`);
    }
  }
  return offences;
}

describe('feature boundaries', () => {
  it('when scanning src/features, then there are features to check', () => {
    expect(readdirSync(FEATURES_DIR).sort()).toEqual(expect.arrayContaining(['auth', 'projects']));
  });

  it('when a feature imports, then it never reaches into another feature', () => {
    expect(crossFeatureImports()).toEqual([]);
  });
});
