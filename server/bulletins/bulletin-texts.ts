import { DEFAULT_LANGUAGE, textsFor, type Language } from '../i18n';

const CAUTION_KEYS = ['estimate', 'authority', 'trainedStaff', 'clinicians'] as const;

/**
 * Broodcast's cautions as every advisory and bulletin says them (DESIGN.md §5), in its own words and in
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

/** The per-recipient end of every subscription mail: why they get it, one-click unsubscribe, preferences. */
export function mailFooter(districtName: string, unsubscribeUrl: string, preferencesUrl: string, language: Language = DEFAULT_LANGUAGE) {
  const t = textsFor(language, 'common');
  const why = t('footer.why', { district: districtName });
  return {
    text: [t('signature'), why, t('footer.stopText', { district: districtName, url: unsubscribeUrl }), t('footer.chooseText', { url: preferencesUrl })].join('\n'),
    html: `<hr style="border:none;border-top:1px solid #ccc"><p style="font-size:12px;color:#555">${escapeHtml(t('signature'))}. ${escapeHtml(why)}<br>
<a href="${escapeHtml(unsubscribeUrl)}">${escapeHtml(t('footer.stopLink', { district: districtName }))}</a> ${escapeHtml(t('footer.oneClick'))} ·
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
