import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';

/**
 * Every translation file has the same keys in every language, so no screen, advisory or bulletin
 * falls back to English silently. Client resources live in src/i18n/locales, server resources (mail,
 * advisories, bulletins) in server/i18n/locales; both are <language>/<namespace>.json.
 */
const LANGUAGES = ['en', 'fr', 'es', 'pt'];
const ROOTS = ['src/i18n/locales', 'server/i18n/locales'].filter((r) => existsSync(r));

function flatten(value: unknown, prefix = ''): string[] {
  if (value && typeof value === 'object' && !Array.isArray(value)) {
    return Object.entries(value as Record<string, unknown>).flatMap(([k, v]) => flatten(v, prefix ? `${prefix}.${k}` : k));
  }
  return [prefix];
}

/** i18next plural suffixes differ by language (French has _many, English does not): compare the base key. */
const PLURAL = /_(zero|one|two|few|many|other)$/;
const base = (key: string) => key.replace(PLURAL, '');

function interpolations(value: unknown): string[] {
  return typeof value === 'string' ? [...value.matchAll(/\{\{\s*([\w.]+)[^}]*\}\}/g)].map((m) => m[1]).sort() : [];
}

function leaves(value: unknown, prefix = ''): Map<string, unknown> {
  const out = new Map<string, unknown>();
  if (value && typeof value === 'object' && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) for (const [kk, vv] of leaves(v, prefix ? `${prefix}.${k}` : k)) out.set(kk, vv);
  } else out.set(prefix, value);
  return out;
}

describe('translations', () => {
  for (const root of ROOTS) {
    const namespaces = new Set(LANGUAGES.flatMap((l) => (existsSync(join(root, l)) ? readdirSync(join(root, l)) : [])).filter((f) => f.endsWith('.json')));
    for (const file of namespaces) {
      it(`when ${root}/*/${file} is read, then every language has the same keys and placeholders`, () => {
        const byLanguage = Object.fromEntries(
          LANGUAGES.map((l) => {
            const path = join(root, l, file);
            expect(existsSync(path), `${path} is missing`).toBe(true);
            return [l, JSON.parse(readFileSync(path, 'utf8')) as unknown];
          }),
        );
        const en = new Set(flatten(byLanguage.en).map(base));
        const enLeaves = leaves(byLanguage.en);
        for (const l of LANGUAGES.slice(1)) {
          const other = new Set(flatten(byLanguage[l]).map(base));
          expect([...en].filter((k) => !other.has(k)), `keys of ${file} missing in ${l}`).toEqual([]);
          expect([...other].filter((k) => !en.has(k)), `keys of ${file} in ${l} but not in en`).toEqual([]);
          for (const [key, value] of leaves(byLanguage[l])) {
            const enValue = enLeaves.get(key) ?? enLeaves.get(`${base(key)}_other`);
            if (enValue === undefined) continue;
            expect(interpolations(value), `placeholders of ${l}:${file}:${key}`).toEqual(interpolations(enValue));
            expect(typeof value === 'string' && value.trim().length > 0, `${l}:${file}:${key} is empty`).toBe(true);
          }
        }
      });
    }
  }
});
