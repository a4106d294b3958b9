import { describe, expect, it } from 'vitest';
import { passwordResetMail } from '../../server/auth/auth.mails';
import { htmlStart } from '../../server/bulletins/bulletin-texts';

/** Issue 21: every mail's HTML declares UTF-8, so "Théo" and "à" arrive whole in every mail program. */
describe('mail HTML character set', () => {
  it('when a password-reset mail is written in French, then its HTML is a document that declares UTF-8 and its language', () => {
    const mail = passwordResetMail('Théo Ménard', 'https://example.test/reset-password?token=x', 2, 'fr');
    expect(mail.html).toMatch(/^<!doctype html><html lang="fr"><head><meta charset="utf-8">/);
    expect(mail.html).toContain('Théo Ménard');
    expect(mail.html.endsWith('</html>')).toBe(true);
  });

  it('when a bulletin, advisory or field-week mail starts, then its head declares UTF-8', () => {
    expect(htmlStart('pt')).toContain('<meta charset="utf-8">');
  });
});
