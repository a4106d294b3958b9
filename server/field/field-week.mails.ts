import type { WorkKind } from '../../shared/field/work-kinds';
import { cautionsFor, escapeHtml, htmlStart } from '../bulletins/bulletin-texts';
import { formatFor, textsFor, type Language } from '../i18n';

export interface MemberPlan {
  team: string;
  base: string;
  /** Every working day of the week, with the district of the day when one is planned. */
  days: { day: string; district: { name: string; code: string; work: readonly WorkKind[] } | null }[];
}

/** The published Field week as mailed to one team member, in their language (plain text and HTML, same words). */
export function fieldWeekMail(input: { language: Language; start: string; end: string; teams: MemberPlan[]; publishedBy: string }) {
  const t = textsFor(input.language, 'field');
  const c = textsFor(input.language, 'common');
  const f = formatFor(input.language);
  const vars = { start: f.date(input.start), end: f.date(input.end) };
  const subject = t('subject', vars);
  const heading = t('heading', vars);
  const kinds = (work: readonly WorkKind[]) => work.map((k) => t(`kinds.${k}`)).join(', ');
  const lines = (plan: MemberPlan) => plan.days.map((d) => ({
    day: d.district ? t('dayLine', { day: f.date(d.day), district: d.district.name, code: d.district.code }) : t('noWork', { day: f.date(d.day) }),
    work: d.district ? t('workNeeded', { kinds: kinds(d.district.work) }) : null,
  }));
  const cautions = [c('actionCaution'), ...cautionsFor(input.language)];
  const text = [
    heading, '', t('intro'), '',
    ...input.teams.flatMap((p) => [t('team', { team: p.team, base: p.base }), ...lines(p).flatMap((l) => [`- ${l.day}`, ...(l.work ? [`  ${l.work}`] : [])]), '']),
    t('publishedBy', { name: input.publishedBy }), '',
    c('keepInMind'), ...cautions.map((x) => `- ${x}`), '', c('signature'),
  ].join('\n');
  const html = `${htmlStart(input.language, 640)}
<h1 style="font-size:20px">${escapeHtml(heading)}</h1>
<p>${escapeHtml(t('intro'))}</p>
${input.teams.map((p) => `<h2 style="font-size:16px">${escapeHtml(t('team', { team: p.team, base: p.base }))}</h2>
<ul>${lines(p).map((l) => `<li>${escapeHtml(l.day)}${l.work ? `<br><small>${escapeHtml(l.work)}</small>` : ''}</li>`).join('')}</ul>`).join('\n')}
<p>${escapeHtml(t('publishedBy', { name: input.publishedBy }))}</p>
<h2 style="font-size:16px">${escapeHtml(c('keepInMind'))}</h2>
<ul>${cautions.map((x) => `<li>${escapeHtml(x)}</li>`).join('')}</ul>
<p style="font-size:12px;color:#555">${escapeHtml(c('signature'))}</p>
</body></html>`;
  return { subject, text, html };
}
