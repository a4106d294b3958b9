import type { Role } from '../../shared/roles';
import { DEFAULT_LANGUAGE, textsFor, type Language } from '../i18n';

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** A name on one line: control characters (a CR/LF that would start a new line in the text body) become spaces. */
export const oneLine = (s: string) => s.replace(/[\p{Cc}\u2028\u2029]+/gu, ' ').trim();

function linkMail(language: Language, subject: string, greeting: string, lines: string[], link: string, linkLabel: string) {
  const signature = textsFor(language, 'common')('signature');
  const text = [greeting, '', ...lines, '', `${linkLabel}: ${link}`, '', signature].join('\n');
  // A whole document with its language and character set (as the bulletins' htmlStart), so accented names arrive whole.
  const html = `<!doctype html><html lang="${language}"><head><meta charset="utf-8"></head><body><p>${escapeHtml(greeting)}</p>${lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('')}
<p><a href="${escapeHtml(link)}">${escapeHtml(linkLabel)}</a></p><p>${escapeHtml(signature)}</p></body></html>`;
  // Content-Language (RFC 3282) says which language the mail is written in.
  return { subject, text, html, headers: { 'Content-Language': language } };
}

/** The password-reset mail, in the account's language. */
export function passwordResetMail(name: string, link: string, ttlHours: number, language: Language = DEFAULT_LANGUAGE) {
  const t = textsFor(language, 'auth');
  return linkMail(language, t('reset.subject'), t('greeting', { name: oneLine(name) }), [t('reset.asked'), t('reset.validity', { count: ttlHours })], link, t('reset.link'));
}

/** The invitation's one-time link; `lang` opens the landing page in the invite's language. */
export function inviteLink(appUrl: string, token: string, language: Language): string {
  const url = new URL('/invite/accept', appUrl);
  url.searchParams.set('token', token);
  url.searchParams.set('lang', language);
  return url.toString();
}

/** The password-reset link; `lang` opens the page in the account's language. */
export function resetLink(appUrl: string, token: string, language: Language): string {
  const url = new URL('/reset-password', appUrl);
  url.searchParams.set('token', token);
  url.searchParams.set('lang', language);
  return url.toString();
}

/** The invitation, in the language the admin chose for the invitee (English when none). */
export function inviteMail(name: string, role: Role, link: string, ttlHours: number, language: Language = DEFAULT_LANGUAGE) {
  const t = textsFor(language, 'auth');
  const roleLabel = textsFor(language, 'common')(`roles.${role}`);
  return linkMail(language, t('invite.subject'), t('greeting', { name: oneLine(name) }), [t('invite.given', { role: roleLabel }), t('invite.validity', { count: ttlHours })], link, t('invite.link'));
}
