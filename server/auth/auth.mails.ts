const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function linkMail(subject: string, greeting: string, lines: string[], link: string, linkLabel: string) {
  const text = [greeting, '', ...lines, '', `${linkLabel}: ${link}`, '', '— Broodcast'].join('\n');
  const html = `<p>${escapeHtml(greeting)}</p>${lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('')}
<p><a href="${escapeHtml(link)}">${escapeHtml(linkLabel)}</a></p><p>— Broodcast</p>`;
  return { subject, text, html };
}

export const passwordResetMail = (name: string, link: string, ttlHours: number) =>
  linkMail(
    'Broodcast: set a new password',
    `Hello ${name},`,
    [
      'Someone asked to set a new password for your Broodcast account. If it was you, use the link below.',
      `The link works once and for ${ttlHours} hour${ttlHours === 1 ? '' : 's'}. If it was not you, ignore this message; your password stays as it is.`,
    ],
    link,
    'Set a new password',
  );

export const inviteMail = (name: string, roleLabel: string, link: string, ttlHours: number) =>
  linkMail(
    'Broodcast: your invitation',
    `Hello ${name},`,
    [
      `You have been given a Broodcast account as ${roleLabel}. Choose your password with the link below to start.`,
      `The link works once and for ${ttlHours} hours.`,
    ],
    link,
    'Choose your password',
  );
