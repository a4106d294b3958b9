import type { ActionDto } from '../../shared/api/flags.schema';
import type { Tier } from '../../shared/tier';
import { cautionsFor, escapeHtml, htmlStart, mailFooter } from '../bulletins/bulletin-texts';
import { DEFAULT_LANGUAGE, textsFor, type Language } from '../i18n';

/** A suggested action in the reader's language (by its id; the stored title and text are the English ones). */
export function actionIn(language: Language, a: Pick<ActionDto, 'id'>): { title: string; text: string } {
  const t = textsFor(language, 'common');
  return { title: t(`actions.${a.id}.title`), text: t(`actions.${a.id}.text`) };
}

/** The advisory as mailed to one subscriber, in their language: plain text and HTML with the same words. */
export function advisoryMail(input: {
  districtName: string;
  districtCode: string;
  tier: Tier | null;
  message: string;
  actions: ActionDto[];
  issuedBy: string;
  unsubscribeUrl: string;
  preferencesUrl: string;
  language?: Language;
}) {
  const language = input.language ?? DEFAULT_LANGUAGE;
  const t = textsFor(language, 'advisory');
  const c = textsFor(language, 'common');
  const vars = { district: input.districtName, code: input.districtCode, tier: input.tier ? c(`tiers.${input.tier}`) : '' };
  const subject = t(input.tier ? 'subjectWithTier' : 'subject', vars);
  const heading = t(input.tier ? 'headingWithTier' : 'heading', vars);
  const actions = input.actions.map((a) => actionIn(language, a));
  const cautions = cautionsFor(language);
  const caution = c('actionCaution');
  const signed = t('signedOffBy', { name: input.issuedBy });
  const footer = mailFooter(input.districtName, input.unsubscribeUrl, input.preferencesUrl, language);
  const text = [
    heading,
    '',
    input.message,
    '',
    c('whatToDo'),
    ...actions.map((a) => `- ${c('labelled', { label: a.title, text: a.text })}`),
    `  ${caution}`,
    '',
    signed,
    '',
    c('keepInMind'),
    ...cautions.map((x) => `- ${x}`),
    '',
    footer.text,
  ].join('\n');
  const html = `${htmlStart(language, 640)}
<h1 style="font-size:20px">${escapeHtml(heading)}</h1>
<p>${escapeHtml(input.message)}</p>
<h2 style="font-size:16px">${escapeHtml(c('whatToDo'))}</h2>
<ul>${actions.map((a) => `<li><strong>${escapeHtml(a.title)}.</strong> ${escapeHtml(a.text)}</li>`).join('')}</ul>
<p><em>${escapeHtml(caution)}</em></p>
<p>${escapeHtml(signed)}</p>
<h2 style="font-size:16px">${escapeHtml(c('keepInMind'))}</h2>
<ul>${cautions.map((x) => `<li>${escapeHtml(x)}</li>`).join('')}</ul>
${footer.html}
</body></html>`;
  return { subject, text, html };
}
