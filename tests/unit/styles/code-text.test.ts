import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import postcss, { type Rule } from 'postcss';
import { describe, expect, it } from 'vitest';

// The app stylesheet turns the font's ligatures and contextual alternates off for code-like
// text, so a mark, shape, id or file name such as "3x4" is drawn as typed, not as "3×4".
const css = postcss.parse(readFileSync(resolve(__dirname, '../../../src/styles/index.css'), 'utf8'));

function declarationsFor(selector: string): Map<string, string> {
  const out = new Map<string, string>();
  css.walkRules((rule: Rule) => {
    if (rule.selectors.map((s) => s.trim()).includes(selector)) rule.walkDecls((d) => void out.set(d.prop, d.value));
  });
  return out;
}

describe('code-like text keeps its characters', () => {
  for (const selector of ['a', 'code', 'kbd', 'table', 'input', '.font-mono', '.figures', '.token']) {
    it(`when text is in ${selector}, then ligatures and contextual alternates are off`, () => {
      const d = declarationsFor(selector);
      expect(d.get('font-variant-ligatures')).toBe('none');
      expect(d.get('font-feature-settings')).toBe('"calt" 0, "liga" 0');
    });
  }

  it('when table figures are lined up, then tabular figures stay on beside it', () => {
    expect(declarationsFor('.figures').get('font-variant-numeric')).toBe('tabular-nums');
  });
});
