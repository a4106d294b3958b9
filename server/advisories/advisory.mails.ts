import { ACTION_CAUTION, type ActionDto } from '../../shared/api/flags.schema';
import { TIER_LABELS, type Tier } from '../../shared/tier';
import { MAIL_CAUTIONS, escapeHtml, mailFooter } from '../bulletins/bulletin-texts';

/** The advisory as mailed to one subscriber: plain text and HTML with the same words. */
export function advisoryMail(input: {
  districtName: string;
  districtCode: string;
  tier: Tier | null;
  message: string;
  actions: ActionDto[];
  issuedBy: string;
  unsubscribeUrl: string;
  preferencesUrl: string;
}) {
  const tier = input.tier ? ` — ${TIER_LABELS[input.tier]} tier` : '';
  const subject = `Broodcast advisory: ${input.districtName}${tier}`;
  const footer = mailFooter(input.districtName, input.unsubscribeUrl, input.preferencesUrl);
  const text = [
    `Advisory for ${input.districtName} (${input.districtCode})${tier}`,
    '',
    input.message,
    '',
    'What to do',
    ...input.actions.map((a) => `- ${a.title}: ${a.text}`),
    `  ${ACTION_CAUTION}`,
    '',
    `Signed off by ${input.issuedBy}.`,
    '',
    'Please keep in mind',
    ...MAIL_CAUTIONS.map((c) => `- ${c}`),
    '',
    footer.text,
  ].join('\n');
  const html = `<!doctype html><html><body style="font-family:Arial,Helvetica,sans-serif;color:#1d2026;max-width:640px">
<h1 style="font-size:20px">Advisory for ${escapeHtml(input.districtName)} (${escapeHtml(input.districtCode)})${escapeHtml(tier)}</h1>
<p>${escapeHtml(input.message)}</p>
<h2 style="font-size:16px">What to do</h2>
<ul>${input.actions.map((a) => `<li><strong>${escapeHtml(a.title)}.</strong> ${escapeHtml(a.text)}</li>`).join('')}</ul>
<p><em>${escapeHtml(ACTION_CAUTION)}</em></p>
<p>Signed off by ${escapeHtml(input.issuedBy)}.</p>
<h2 style="font-size:16px">Please keep in mind</h2>
<ul>${MAIL_CAUTIONS.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul>
${footer.html}
</body></html>`;
  return { subject, text, html };
}
