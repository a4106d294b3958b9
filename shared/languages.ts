/**
 * The languages of the interface, the mail and the bulletins, with the locale each uses for dates and
 * numbers (BCP 47): one list for the client, the server and the API schemas.
 */
export const LANGUAGES = ['en', 'fr', 'es', 'pt'] as const;
export type Language = (typeof LANGUAGES)[number];

export const LANGUAGE_NAMES: Record<Language, string> = { en: 'English', fr: 'Français', es: 'Español', pt: 'Português' };

/** Intl locale per language: British English (day-month order, 24-hour clock), European and African Portuguese (the norm in Angola, Mozambique, Guinea-Bissau, Cabo Verde), and the generic others. */
export const LANGUAGE_LOCALES: Record<Language, string> = { en: 'en-GB', fr: 'fr', es: 'es', pt: 'pt-PT' };

export const isLanguage = (x: unknown): x is Language => typeof x === 'string' && (LANGUAGES as readonly string[]).includes(x);

/** The supported language closest to a BCP 47 tag ("pt-BR" → "pt"), or null. */
export function matchLanguage(tag: string | null | undefined): Language | null {
  if (!tag) return null;
  const base = tag.toLowerCase().split(/[-_]/)[0];
  return isLanguage(base) ? base : null;
}
