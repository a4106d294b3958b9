import { DEFAULT_LANGUAGE, textsFor, type Language } from '../i18n';

const CAUTION_KEYS = ['estimate', 'authority', 'trainedStaff', 'clinicians'] as const;

/**
 * Broodcast's cautions as every advisory and bulletin says them (docs/product.md § Cautions), in its own words and in
 * the reader's language (server/i18n/locales/<language>/common.json, "cautions").
 */
export const cautionsFor = (language: Language): string[] => {
  const t = textsFor(language, 'common');
  return CAUTION_KEYS.map((k) => t(`cautions.${k}`));
};

/** The cautions in English (the default language). */
export const MAIL_CAUTIONS: readonly string[] = cautionsFor(DEFAULT_LANGUAGE);

export const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** The start of every mail's HTML: its language and its character set (UTF-8), so accented words arrive whole. */
export const htmlStart = (language: Language, maxWidth = 680) =>
  `<!doctype html><html lang="${language}"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"></head><body style="font-family:Arial,Helvetica,sans-serif;color:#1d2026;max-width:${maxWidth}px">`;

/** The per-recipient end of every subscription mail: why they get it, one-click unsubscribe, preferences. */
export function mailFooter(districtName: string, unsubscribeUrl: string, preferencesUrl: string, language: Language = DEFAULT_LANGUAGE) {
  const t = textsFor(language, 'common');
  const why = t('footer.why', { district: districtName });
  return {
    text: [t('signature'), why, t('footer.stopText', { district: districtName, url: unsubscribeUrl }), t('footer.chooseText', { url: preferencesUrl })].join('\n'),
    html: `<hr style="border:none;border-top:1px solid #ccc"><p style="font-size:12px;color:#555">${escapeHtml(t('signature'))}. ${escapeHtml(why)}<br>
<a href="${escapeHtml(unsubscribeUrl)}">${escapeHtml(t('footer.stopLink', { district: districtName }))}</a> ${escapeHtml(t('footer.confirmFirst'))} ·
<a href="${escapeHtml(preferencesUrl)}">${escapeHtml(t('footer.chooseLink'))}</a></p>`,
  };
}

/** The per-recipient end of the weekly digest: why they get it, one-click stop of the weekly bulletin, preferences. */
export function digestFooter(followed: number, unsubscribeUrl: string, preferencesUrl: string, language: Language = DEFAULT_LANGUAGE) {
  const t = textsFor(language, 'common');
  const why = t('footer.digestWhy', { count: followed });
  return {
    text: [t('signature'), why, t('footer.digestStopText', { url: unsubscribeUrl }), t('footer.chooseText', { url: preferencesUrl })].join('\n'),
    html: `<hr style="border:none;border-top:1px solid #ccc"><p style="font-size:12px;color:#555">${escapeHtml(t('signature'))}. ${escapeHtml(why)}<br>
<a href="${escapeHtml(unsubscribeUrl)}">${escapeHtml(t('footer.digestStopLink'))}</a> ${escapeHtml(t('footer.confirmFirst'))} ·
<a href="${escapeHtml(preferencesUrl)}">${escapeHtml(t('footer.chooseLink'))}</a></p>`,
  };
}

/** Headers that let mail programs offer their own unsubscribe button (RFC 2369, RFC 8058). */
export const unsubscribeHeaders = (apiUnsubscribeUrl: string) => ({
  'List-Unsubscribe': `<${apiUnsubscribeUrl}>`,
  'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
});

/**
 * The language a mail is written in (RFC 3282 Content-Language). The outbox also reads it to attach the
 * bulletin PDF of that language.
 */
export const languageHeaders = (language: Language) => ({ 'Content-Language': language });
