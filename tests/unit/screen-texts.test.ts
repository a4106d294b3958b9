import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { BASE_NAMESPACES, SCREEN_TEXTS } from '../../src/i18n/screen-texts';

/**
 * Each lazy screen fetches its texts with its code (src/app/router.tsx, src/i18n/screen-texts.ts). A
 * namespace the screen uses but does not list would arrive late (a second round trip on a slow network)
 * or, when read as `t('other:key')`, not at all. This reads the source: the screen's module and every
 * module it imports (static or dynamic, inside src/), and the namespaces they name.
 */
const src = path.resolve('src');
const NAMESPACES = readdirSync(path.join(src, 'i18n/locales/en')).map((f) => f.replace(/\.json$/, ''));
const nsPattern = NAMESPACES.map((n) => n.replace(/-/g, '\\-')).join('|');

function resolveImport(from: string, spec: string): string | null {
  if (!spec.startsWith('.')) return null;
  const base = path.resolve(path.dirname(from), spec);
  for (const c of [`${base}.ts`, `${base}.tsx`, path.join(base, 'index.ts'), path.join(base, 'index.tsx'), base])
    if (/\.(ts|tsx)$/.test(c) && existsSync(c) && c.startsWith(src)) return c;
  return null;
}

/** Namespaces named by a module and everything it imports inside src/. */
function namespacesOf(entry: string): Set<string> {
  const seen = new Set<string>();
  const found = new Set<string>();
  const stack = [entry];
  while (stack.length) {
    const file = stack.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    const text = readFileSync(file, 'utf8');
    for (const m of text.matchAll(/useTranslation\(\s*['"]([a-z-]+)['"]/g)) found.add(m[1]);
    if (/useTranslation\(\s*\)/.test(text)) found.add('common');
    for (const m of text.matchAll(new RegExp(`[\`'"](${nsPattern}):`, 'g'))) found.add(m[1]);
    for (const m of text.matchAll(/\bns:\s*['"]([a-z-]+)['"]/g)) found.add(m[1]);
    for (const m of text.matchAll(/getFixedT\([^,)]*,\s*['"]([a-z-]+)['"]/g)) found.add(m[1]);
    for (const m of text.matchAll(/(?:import|export)\s[^'";]*?from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g)) {
      const next = resolveImport(file, m[1] ?? m[2]);
      if (next) stack.push(next);
    }
  }
  return found;
}

describe('the texts each lazy screen loads with its code', () => {
  it.each(Object.entries(SCREEN_TEXTS))('when %s is opened, then every namespace it uses is loaded with it', (screen, listed) => {
    const file = resolveImport(path.join(src, 'x.ts'), `./${screen}`);
    expect(file, `src/${screen}.tsx`).not.toBeNull();
    const used = [...namespacesOf(file!)].filter((ns) => !(BASE_NAMESPACES as readonly string[]).includes(ns));
    expect(used.filter((ns) => !(listed as readonly string[]).includes(ns)), 'used but not listed in src/i18n/screen-texts.ts').toEqual([]);
    for (const ns of listed) expect(NAMESPACES, `${screen} lists ${ns}`).toContain(ns);
  });

  it('when the router loads a screen lazily, then the screen has an entry in screen-texts.ts', () => {
    const router = readFileSync(path.join(src, 'app/router.tsx'), 'utf8');
    const screens = [...router.matchAll(/screen\(\s*'([^']+)',\s*\(\)\s*=>\s*import\('([^']+)'\)/g)];
    expect(screens.length).toBeGreaterThan(20);
    for (const [, key, spec] of screens) {
      expect(Object.keys(SCREEN_TEXTS)).toContain(key);
      expect(path.relative(src, path.resolve(src, 'app', spec)), `${key} loads ${spec}`).toBe(key);
    }
  });
});
