import type { Tier } from '../../shared/tier';
import { DEFAULT_LANGUAGE, pdfText, type Language } from '../i18n';
import type { DigestLayout } from './bulletin-digest.entity';
import type { BulletinData } from './bulletin-data';
import {
  badgeHtml, cautionsHtml, cautionTextLines, districtHtml, districtTextLines, drawCautionsPdf, drawDistrictPdf, drawRankingPdf, e,
  htmlStart, joinLines, pdfWriter, rankingHtml, rankingTextLines, wordsFor, type RankingRow, type Words,
} from './bulletin.render';

/**
 * One person's weekly digest: every district they follow in one mail (issue 16, "one bulletin per person").
 * `detail`: each followed district in full, the person's own (assigned) districts first, then the region's
 * ranking — for a community worker, and anyone else following three districts or fewer. `overview`: the
 * region's ranking with the followed districts marked, the followed districts whose tier changed since the
 * week before (from → to), and those districts in full — for health officers and supervisors, and anyone
 * following more than three.
 */
export interface DigestData {
  region: string;
  epiYear: number;
  epiWeek: number;
  layout: DigestLayout;
  /** How many districts the person follows (those with a bulletin this week). */
  followed: number;
  /** Their ids, in the Ladder's order. */
  followedIds: string[];
  /** The districts shown in full, in order. */
  detailed: BulletinData[];
  /** The whole region, ranked; `isThis` marks the followed districts. */
  ranking: RankingRow[];
  /** Followed districts whose tier changed since the week before. */
  changes: { name: string; code: string; from: Tier; to: Tier }[];
}

/** The attachment's name: broodcast-<region>-<year>-w<week>.pdf, the region as a lower-case ASCII slug. */
export function digestPdfName(region: string, epiYear: number, epiWeek: number): string {
  const slug = region.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || 'region';
  return `broodcast-${slug}-${epiYear}-w${String(epiWeek).padStart(2, '0')}.pdf`;
}

export function digestSubject(g: DigestData, language: Language = DEFAULT_LANGUAGE): string {
  const w = wordsFor(language);
  return w.t('digest.subject', { region: g.region, week: g.epiWeek, year: g.epiYear, count: g.followed });
}

const changeLine = (c: DigestData['changes'][number], w: Words) =>
  w.t('digest.changeLine', { district: c.name, code: c.code, from: w.tier(c.from), to: w.tier(c.to) });

const overview = (g: DigestData) => g.layout === 'overview';

export function digestText(g: DigestData, language: Language = DEFAULT_LANGUAGE): string {
  const w = wordsFor(language);
  const { t } = w;
  const out: string[] = [t('digest.textTitle', { region: g.region, week: g.epiWeek, year: g.epiYear }), t('digest.lead', { count: g.followed }), ''];
  if (overview(g)) {
    out.push(...rankingTextLines(g.ranking, w, t('digest.followedMarker')), '', t('digest.changesHeading'));
    if (g.changes.length === 0) out.push(`- ${t('digest.noChanges')}`);
    for (const c of g.changes) out.push(`- ${changeLine(c, w)}`);
    out.push('');
    for (const d of g.detailed) out.push('', ...districtTextLines(d, w), '');
  } else {
    for (const d of g.detailed) out.push(...districtTextLines(d, w), '', '');
    out.push(...rankingTextLines(g.ranking, w, t('digest.followedMarker')));
  }
  out.push('', ...cautionTextLines(w));
  return joinLines(out);
}

export function digestHtml(g: DigestData, language: Language = DEFAULT_LANGUAGE): string {
  const w = wordsFor(language);
  const { t } = w;
  const parts: string[] = [
    htmlStart(language),
    `<h1 style="font-size:20px;margin-bottom:4px">${e(t('digest.title', { region: g.region }))}</h1>`,
    `<p style="margin-top:0;color:#555">${e(t('week', { week: g.epiWeek, year: g.epiYear }))} · ${e(t('digest.lead', { count: g.followed }))}</p>`,
  ];
  const detailed = g.detailed.flatMap((d) => ['<hr style="border:none;border-top:1px solid #ccc">', ...districtHtml(d, w, 2)]);
  if (overview(g)) {
    parts.push(...rankingHtml(g.ranking, w, t('regionHeading')));
    parts.push(`<h2 style="font-size:16px">${e(t('digest.changesHeading'))}</h2>`);
    parts.push(g.changes.length === 0 ? `<p>${e(t('digest.noChanges'))}</p>`
      : `<ul>${g.changes.map((c) => `<li>${e(c.name)} (${e(c.code)}): ${badgeHtml(c.from, w)} → ${badgeHtml(c.to, w)}</li>`).join('')}</ul>`);
    parts.push(...detailed);
  } else {
    parts.push(...detailed, '<hr style="border:none;border-top:1px solid #ccc">', ...rankingHtml(g.ranking, w, t('regionHeading')));
  }
  parts.push(cautionsHtml(w), '<!--footer--></body></html>');
  return parts.join('\n');
}

export function digestPdf(g: DigestData, language: Language = DEFAULT_LANGUAGE): Promise<Buffer> {
  const pw = pdfWriter(language, digestSubject(g, language));
  const { doc, w, left } = pw;
  const { t } = w;
  doc.font('Helvetica-Bold').fontSize(18).fillColor('#1d2026').text(pdfText(t('digest.title', { region: g.region })), left);
  doc.font('Helvetica').fontSize(10).fillColor('#555555').text(pdfText(`${t('week', { week: g.epiWeek, year: g.epiYear })}. ${t('digest.lead', { count: g.followed })}`));
  doc.moveDown(0.6);
  const details = () => {
    for (const d of g.detailed) {
      doc.addPage();
      drawDistrictPdf(pw, d, 16);
    }
  };
  if (overview(g)) {
    drawRankingPdf(pw, g.ranking, t('regionHeading'));
    pw.heading(t('digest.changesHeading'));
    if (g.changes.length === 0) pw.para(t('digest.noChanges'));
    for (const c of g.changes) pw.para(changeLine(c, w));
    details();
    drawCautionsPdf(pw);
  } else {
    for (const [i, d] of g.detailed.entries()) {
      if (i > 0) doc.addPage();
      drawDistrictPdf(pw, d, 16);
    }
    drawRankingPdf(pw, g.ranking, t('regionHeading'));
    drawCautionsPdf(pw);
  }
  return pw.end();
}

/** The digest as written in one language, before the per-recipient footer. */
export interface DigestVersion {
  subject: string;
  html: string;
  text: string;
  pdf: Buffer;
}

export async function renderDigest(g: DigestData, language: Language): Promise<DigestVersion> {
  return { subject: digestSubject(g, language), html: digestHtml(g, language), text: digestText(g, language), pdf: await digestPdf(g, language) };
}

/**
 * Assemble a person's digest from the week's district data (read once per send) and the Ladder's rows.
 * `assigned` are the person's own districts (shown first in the detail layout).
 */
export function digestData(input: {
  region: string;
  epiYear: number;
  epiWeek: number;
  role: string;
  followedIds: string[];
  assigned: string[];
  data: Map<string, BulletinData>;
  board: { districtId: string; rank: number; code: string; name: string; tier: Tier; score: number; confidence: string; tierChange: number | null }[];
  /**
   * For a person scoped to regions (issue 17): the districts of their regions and their own. The ranking then
   * covers these only, ranked among themselves, and `region` names their regions.
   */
  scope?: ReadonlySet<string> | null;
}): DigestData {
  const followed = new Set(input.followedIds);
  const ordered = input.board.filter((r) => followed.has(r.districtId) && input.data.has(r.districtId));
  const layout: DigestLayout = input.role === 'officer' || input.role === 'supervisor' || ordered.length > 3 ? 'overview' : 'detail';
  const changed = ordered.filter((r) => r.tierChange !== null && r.tierChange !== 0);
  const detailRows = layout === 'overview'
    ? changed
    : [...ordered.filter((r) => input.assigned.includes(r.districtId)), ...ordered.filter((r) => !input.assigned.includes(r.districtId))];
  return {
    region: input.region,
    epiYear: input.epiYear,
    epiWeek: input.epiWeek,
    layout,
    followed: ordered.length,
    followedIds: ordered.map((r) => r.districtId),
    detailed: detailRows.map((r) => input.data.get(r.districtId)!),
    ranking: (input.scope ? input.board.filter((r) => input.scope!.has(r.districtId)) : input.board)
      .map((r, i) => ({ rank: input.scope ? i + 1 : r.rank, code: r.code, name: r.name, tier: r.tier, score: r.score, confidence: r.confidence, isThis: followed.has(r.districtId) })),
    changes: changed.map((r) => ({ name: r.name, code: r.code, from: previousTier(r), to: r.tier })),
  };
}

/** The tier the week before, from the Ladder's change (a count of tier steps). */
function previousTier(r: { tier: Tier; tierChange: number | null }): Tier {
  const order: Tier[] = ['baseline', 'raised', 'high', 'critical'];
  return order[Math.max(0, Math.min(3, order.indexOf(r.tier) - (r.tierChange ?? 0)))];
}
