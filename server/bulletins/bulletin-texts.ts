/** Broodcast's cautions as every advisory and bulletin says them (DESIGN.md §5), in its own words. */
export const MAIL_CAUTIONS = [
  'Broodcast estimates how favourable conditions are for mosquitoes and for transmission, from weather, reported cases and larval surveys. It does not diagnose anyone, count mosquitoes or say for certain how many cases will come.',
  'Decisions on warnings and on the response belong to the national health authority; follow its guidelines.',
  'Larvicides, insecticides and fogging are for trained staff only, used under local regulations and as the product label directs.',
  'Questions about someone\u2019s illness or treatment go to a licensed clinician.',
] as const;

export const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** The per-recipient end of every subscription mail: why they get it, one-click unsubscribe, preferences. */
export function mailFooter(districtName: string, unsubscribeUrl: string, preferencesUrl: string) {
  const why = `You receive this because you are subscribed to ${districtName} in Broodcast.`;
  return {
    text: [`— Broodcast`, why, `Stop mail for ${districtName} (one click): ${unsubscribeUrl}`, `Choose which districts you receive: ${preferencesUrl}`].join('\n'),
    html: `<hr style="border:none;border-top:1px solid #ccc"><p style="font-size:12px;color:#555">— Broodcast. ${escapeHtml(why)}<br>
<a href="${escapeHtml(unsubscribeUrl)}">Stop mail for ${escapeHtml(districtName)}</a> (one click, no sign-in) ·
<a href="${escapeHtml(preferencesUrl)}">Choose which districts you receive</a></p>`,
  };
}

/** Headers that let mail programs offer their own unsubscribe button (RFC 2369, RFC 8058). */
export const unsubscribeHeaders = (apiUnsubscribeUrl: string) => ({
  'List-Unsubscribe': `<${apiUnsubscribeUrl}>`,
  'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
});
