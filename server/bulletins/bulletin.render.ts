import PDFDocument from 'pdfkit';
import { DRIVER_LABELS, shareOf, type Tier } from '../../shared/tier';
import { actionIn } from '../advisories/advisory.mails';
import { messageFor } from '../flags/flag-texts';
import { DEFAULT_LANGUAGE, formatFor, pdfText, textsFor, type Language } from '../i18n';
import type { BulletinData, CaseWeek } from './bulletin-data';
import { cautionsFor, escapeHtml, htmlStart } from './bulletin-texts';
export { htmlStart } from './bulletin-texts';

/**
 * The same sequential single-hue tier scale as the client's (src/features/ladder/tier-scale.ts): it keeps
 * its order in grayscale, and every tier is also written as a word.
 */
const TIER_FILL: Record<Tier, string> = { baseline: '#f3e9f1', raised: '#d2a6c8', high: '#94508a', critical: '#3f1239' };
const TIER_INK: Record<Tier, string> = { baseline: '#1d2026', raised: '#1d2026', high: '#ffffff', critical: '#ffffff' };

/** The words and number formats of one bulletin language. */
export function wordsFor(language: Language) {
  const t = textsFor(language, 'bulletin');
  const c = textsFor(language, 'common');
  const f = formatFor(language);
  return {
    language,
    t,
    c,
    f,
    tier: (x: Tier) => c(`tiers.${x}`),
    num: (x: number | null | undefined, digits = 0) => f.number(x, digits, true),
    score: (x: number) => f.number(x, 2, true),
    pct: (x: number) => f.percent(x),
    date: (iso: string) => f.date(iso),
  };
}
export type Words = ReturnType<typeof wordsFor>;
export type RankingRow = BulletinData['ranking'][number];

export function bulletinSubject(d: BulletinData, language: Language = DEFAULT_LANGUAGE): string {
  const w = wordsFor(language);
  const vars = { district: d.district.name, week: d.epiWeek, year: d.epiYear };
  return d.tier ? w.t('subject', { ...vars, tier: w.tier(d.tier.tier) }) : w.t('subjectNoTier', vars);
}

function tierSentence(d: BulletinData, w: Words): string {
  if (!d.tier) return w.t('noTier');
  const confidence = ['stale', 'insufficient'].includes(d.tier.confidence) ? d.tier.confidence : 'ok';
  const main = w.t(`atTier.${confidence}`, { district: d.district.name, tier: w.tier(d.tier.tier), score: w.score(d.tier.score) });
  return d.tier.tierLow !== d.tier.tierHigh ? `${main} ${w.t('range', { low: w.tier(d.tier.tierLow), high: w.tier(d.tier.tierHigh) })}` : main;
}

const DRIVER_BY_LABEL = new Map(Object.entries(DRIVER_LABELS).map(([id, label]) => [label, id]));

/** The season run's notes are stored in English: the known ones are said in the reader's language, any other as stored. */
function noteIn(note: string, w: Words): string {
  if (note === 'No driver has data yet: the tier cannot be estimated.') return w.t('notes.noDriver');
  if (note === 'No weather for this district.') return w.t('notes.noWeather');
  let m = /^(.+): no data; its weight is shared among the others\.$/.exec(note);
  if (m && DRIVER_BY_LABEL.has(m[1])) return w.t('notes.driverNoData', { driver: w.c(`drivers.${DRIVER_BY_LABEL.get(m[1])}`) });
  m = /^The newest weather is (\d+) days? old\.$/.exec(note);
  if (m) return w.t('notes.weatherAge', { count: Number(m[1]) });
  m = /^The newest case count is (\d+) weeks? old\.$/.exec(note);
  if (m) return w.t('notes.caseAge', { count: Number(m[1]) });
  return note;
}

const recentWeeks = (weeks: CaseWeek[], n = 6) => weeks.slice(Math.max(0, weeks.length - n));
/** An open week (reporting not over) is never called above, within or below the channel: its count is partial. */
const zoneWord = (wk: CaseWeek, w: Words) =>
  wk.open ? (wk.count === null ? '' : w.t('zone.open')) : wk.count === null || wk.upper === null ? '' : w.t(`zone.${wk.count > wk.upper ? 'above' : wk.lower !== null && wk.count < wk.lower ? 'below' : 'within'}`);
/** `count` picks the plural form (a missing count reads as several); `cases` is the formatted number. */
const caseVars = (wk: CaseWeek, w: Words) => ({ week: wk.week, count: wk.count ?? 2, cases: w.num(wk.count), lower: w.num(wk.lower, 1), upper: w.num(wk.upper, 1) });
const labelled = (label: string, text: string, w: Words) => w.c('labelled', { label, text });
const driverName = (dr: { id: string }, w: Words) => w.c(`drivers.${dr.id}`);
const advisoryLine = (a: BulletinData['advisories'][number], w: Words) => {
  const vars = { date: w.date(a.issuedAt), message: messageFor(w.language, a.message, a.composed) };
  return a.tier ? w.t('advisoryItemTier', { ...vars, tier: w.tier(a.tier) }) : w.t('advisoryItem', vars);
};
const weekLine = (d: BulletinData, w: Words) =>
  d.asOf ? w.t('weekAsOf', { week: d.epiWeek, year: d.epiYear, date: w.date(d.asOf) }) : w.t('week', { week: d.epiWeek, year: d.epiYear });

/** One district's part of a bulletin as plain text: title, tier, drivers, cases, advisories, what to do. */
export function districtTextLines(d: BulletinData, w: Words): string[] {
  const { t, c } = w;
  const out: string[] = [
    t('textTitle', { district: d.district.name, code: d.district.code, week: d.epiWeek, year: d.epiYear }),
    d.district.isDemo ? t('demoLong') : '',
    '',
    tierSentence(d, w),
    '',
  ];
  if (d.tier) {
    out.push(t('driversHeading'));
    for (const dr of d.tier.drivers)
      out.push(`- ${labelled(driverName(dr, w), dr.score === null ? t('driverNoData') : t('driverLine', { score: w.score(dr.score), weight: w.f.number(dr.weight, 2), share: w.pct(shareOf(d.tier.drivers, dr.id)) }), w)}`);
    for (const n of d.tier.notes) out.push(`  ${t('note', { note: noteIn(n, w) })}`);
    out.push('');
  }
  out.push(t('casesHeadingRecent'));
  if (d.cases.length === 0) out.push(`- ${t('noCases')}`);
  for (const cs of d.cases) {
    out.push(labelled(cs.diseaseName, '', w).trimEnd());
    for (const wk of recentWeeks(cs.weeks)) out.push(`  ${t('caseLine', caseVars(wk, w))}${zoneWord(wk, w) ? ` (${zoneWord(wk, w)})` : ''}`);
  }
  out.push('', t('advisoriesHeading'));
  if (d.advisories.length === 0) out.push(`- ${t('none')}`);
  for (const a of d.advisories) out.push(`- ${advisoryLine(a, w)}`);
  out.push('', c('whatToDo'));
  for (const a of d.actions) {
    const x = actionIn(w.language, a);
    out.push(`- ${labelled(x.title, x.text, w)}`);
  }
  out.push(`  ${c('actionCaution')}`);
  return out;
}

/** Rows of the region's ranking a mail shows in full: the first ones, and every marked one. */
export const RANKING_TOP = 20;

/**
 * The part of the ranking a bulletin prints: the top RANKING_TOP districts and every marked (followed) one
 * below them, and how many were left out. A national ranking of thousands of districts made every mail
 * about 2 MB, even for a worker who follows one district; the whole ranking stays on the Ladder.
 */
export function rankingExcerpt(ranking: RankingRow[], top = RANKING_TOP): { rows: RankingRow[]; omitted: number } {
  const rows = ranking.filter((r, i) => i < top || r.isThis);
  return { rows, omitted: ranking.length - rows.length };
}

/** A ranked district's tier in words; one without enough data to estimate is not called Baseline. */
const rankTier = (r: RankingRow, w: Words) => (r.confidence === 'insufficient' ? w.t('tierNotEstimated') : w.tier(r.tier));

/** The region's ranking as plain-text lines; `marker` is written after the marked rows. */
export function rankingTextLines(ranking: RankingRow[], w: Words, marker: string): string[] {
  const { rows, omitted } = rankingExcerpt(ranking);
  return [
    w.t('regionHeadingCount', { count: ranking.length }),
    ...rows.map((r) => `${String(r.rank).padStart(3)}. ${r.name} (${r.code}) — ${rankTier(r, w)}, ${w.score(r.score)}${r.isThis ? `  ${marker}` : ''}`),
    ...(omitted > 0 ? [w.t('regionOmitted', { count: omitted })] : []),
  ];
}

export const cautionTextLines = (w: Words) => [w.c('keepInMind'), ...cautionsFor(w.language).map((x) => `- ${x}`)];
export const joinLines = (lines: string[]) => lines.filter((l, i, a) => !(l === '' && a[i - 1] === '')).join('\n');

/** The plain-text bulletin in `language` (the footer with the recipient's own links is added per recipient). */
export function bulletinText(d: BulletinData, language: Language = DEFAULT_LANGUAGE): string {
  const w = wordsFor(language);
  return joinLines([...districtTextLines(d, w), '', ...rankingTextLines(d.ranking, w, w.t('thisDistrict')), '', ...cautionTextLines(w)]);
}

/** A small inline SVG: this season's weekly cases as bars over the channel band (mail programs that drop SVG still have the table). */
function casesSvg(weeks: CaseWeek[], w: Words): string {
  const W = 520, H = 140, pad = 24;
  const max = Math.max(1, ...weeks.map((x) => Math.max(x.count ?? 0, x.upper ?? 0)));
  const x = (i: number) => pad + (i * (W - 2 * pad)) / Math.max(1, weeks.length);
  const y = (v: number) => H - pad - (v / max) * (H - 2 * pad);
  const bw = Math.max(1, (W - 2 * pad) / Math.max(1, weeks.length) - 2);
  const band = weeks.filter((k) => k.upper !== null && k.lower !== null);
  const top = band.map((k) => `${x(k.week - 1) + bw / 2},${y(k.upper!)}`);
  const bottom = [...band].reverse().map((k) => `${x(k.week - 1) + bw / 2},${y(k.lower!)}`);
  const bars = weeks.map((k, i) => (k.count === null ? '' : `<rect x="${x(i)}" y="${y(k.count)}" width="${bw}" height="${H - pad - y(k.count)}" fill="#3f1239"/>`)).join('');
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" role="img" aria-label="${escapeHtml(w.t('chart.label'))}">
${band.length > 1 ? `<polygon points="${[...top, ...bottom].join(' ')}" fill="#d2a6c8" fill-opacity="0.6"/>` : ''}${bars}
<line x1="${pad}" y1="${H - pad}" x2="${W - pad}" y2="${H - pad}" stroke="#555"/>
<text x="${pad}" y="${H - 6}" font-size="10" fill="#555">${escapeHtml(w.t('chart.week', { week: 1 }))}</text><text x="${W - pad}" y="${H - 6}" font-size="10" fill="#555" text-anchor="end">${escapeHtml(w.t('chart.week', { week: weeks.length }))}</text>
<text x="${pad}" y="12" font-size="10" fill="#555">${escapeHtml(w.t('chart.max', { max: w.num(Math.round(max)) }))}</text></svg>`;
}

const td = 'style="padding:3px 8px;border-bottom:1px solid #ddd;text-align:left"';

export const e = escapeHtml;
export const badgeHtml = (x: Tier, w: Words) =>
  `<span style="background:${TIER_FILL[x]};color:${TIER_INK[x]};padding:1px 6px;border-radius:3px;border:1px solid #3f1239">${e(w.tier(x))}</span>`;

/** One district's part of a bulletin as HTML; `top` is the heading level of its title (1 alone, 2 in a digest). */
export function districtHtml(d: BulletinData, w: Words, top = 1): string[] {
  const { t, c } = w;
  const h = (n: number) => `h${Math.min(6, top + n)}`;
  const parts: string[] = [
    `<${h(0)} style="font-size:${top === 1 ? 20 : 18}px;margin-bottom:4px">${e(t('title', { district: d.district.name, code: d.district.code }))}</${h(0)}>`,
    `<p style="margin-top:0;color:#555">${e(weekLine(d, w))}${d.district.isDemo ? ` · <strong>${e(t('demoShort'))}</strong>` : ''}</p>`,
    `<p>${d.tier ? badgeHtml(d.tier.tier, w) + ' ' : ''}${e(tierSentence(d, w))}</p>`,
  ];
  if (d.tier) {
    parts.push(`<${h(1)} style="font-size:16px">${e(t('driversHeading'))}</${h(1)}><table style="border-collapse:collapse"><tr><th ${td}>${e(t('table.driver'))}</th><th ${td}>${e(t('table.score'))}</th><th ${td}>${e(t('table.weight'))}</th><th ${td}>${e(t('table.share'))}</th></tr>`);
    for (const dr of d.tier.drivers)
      parts.push(`<tr><td ${td}>${e(driverName(dr, w))}</td><td ${td}>${dr.score === null ? e(t('noData')) : w.score(dr.score)}</td><td ${td}>${w.f.number(dr.weight, 2)}</td><td ${td}>${e(w.pct(shareOf(d.tier.drivers, dr.id)))}</td></tr>`);
    parts.push('</table>');
    if (d.tier.notes.length) parts.push(`<ul style="font-size:13px;color:#555">${d.tier.notes.map((n) => `<li>${e(noteIn(n, w))}</li>`).join('')}</ul>`);
  }
  parts.push(`<${h(1)} style="font-size:16px">${e(t('casesHeading'))}</${h(1)}>`);
  if (d.cases.length === 0) parts.push(`<p>${e(t('noCases'))}</p>`);
  for (const cs of d.cases) {
    parts.push(`<${h(2)} style="font-size:14px">${e(cs.diseaseName)}</${h(2)}>${casesSvg(cs.weeks, w)}`);
    parts.push(`<table style="border-collapse:collapse"><tr><th ${td}>${e(t('table.week'))}</th><th ${td}>${e(t('table.cases'))}</th><th ${td}>${e(t('table.usualRange'))}</th><th ${td}></th></tr>`);
    for (const wk of recentWeeks(cs.weeks))
      parts.push(`<tr><td ${td}>${wk.week}</td><td ${td}>${w.num(wk.count)}</td><td ${td}>${e(t('rangeCell', { lower: w.num(wk.lower, 1), upper: w.num(wk.upper, 1) }))}</td><td ${td}>${e(zoneWord(wk, w))}</td></tr>`);
    parts.push('</table>');
  }
  parts.push(`<${h(1)} style="font-size:16px">${e(t('advisoriesHeading'))}</${h(1)}>`);
  parts.push(d.advisories.length === 0 ? `<p>${e(t('none'))}</p>` : `<ul>${d.advisories.map((a) => `<li>${e(advisoryLine(a, w))}</li>`).join('')}</ul>`);
  const actions = d.actions.map((a) => actionIn(w.language, a));
  parts.push(`<${h(1)} style="font-size:16px">${e(c('whatToDo'))}</${h(1)}><ul>${actions.map((a) => `<li><strong>${e(a.title)}.</strong> ${e(a.text)}</li>`).join('')}</ul><p><em>${e(c('actionCaution'))}</em></p>`);
  return parts;
}

/** The region's ranking as an HTML table (marked rows in bold). */
export function rankingHtml(ranking: RankingRow[], w: Words, heading: string, level = 2): string[] {
  const { t } = w;
  const parts = [`<h${level} style="font-size:16px">${e(heading)}</h${level}><table style="border-collapse:collapse"><tr><th ${td}>${e(t('table.rank'))}</th><th ${td}>${e(t('table.district'))}</th><th ${td}>${e(t('table.tier'))}</th><th ${td}>${e(t('table.score'))}</th></tr>`];
  const { rows, omitted } = rankingExcerpt(ranking);
  for (const r of rows)
    parts.push(`<tr${r.isThis ? ' style="font-weight:bold"' : ''}><td ${td}>${r.rank}</td><td ${td}>${e(r.name)} (${e(r.code)})</td><td ${td}>${r.confidence === 'insufficient' ? e(rankTier(r, w)) : badgeHtml(r.tier, w)}</td><td ${td}>${w.score(r.score)}</td></tr>`);
  parts.push('</table>');
  if (omitted > 0) parts.push(`<p style="font-size:13px;color:#555">${e(t('regionOmitted', { count: omitted }))}</p>`);
  return parts;
}

export const cautionsHtml = (w: Words) =>
  `<h2 style="font-size:16px">${e(w.c('keepInMind'))}</h2><ul>${cautionsFor(w.language).map((x) => `<li>${e(x)}</li>`).join('')}</ul>`;

/** The HTML bulletin in `language`, with inline styles only (mail programs drop style sheets). */
export function bulletinHtml(d: BulletinData, language: Language = DEFAULT_LANGUAGE): string {
  const w = wordsFor(language);
  return [htmlStart(language), ...districtHtml(d, w), ...rankingHtml(d.ranking, w, w.t('regionHeading')), cautionsHtml(w), '<!--footer--></body></html>'].join('\n');
}

/** The per-recipient footer goes where the HTML bulletin leaves room for it. */
export const withFooter = (html: string, footerHtml: string) => html.replace('<!--footer-->', footerHtml);

/** A PDF being written in one language, with the small helpers every part of a bulletin uses. */
export interface PdfWriter {
  doc: PDFKit.PDFDocument;
  w: Words;
  left: number;
  width: number;
  heading: (text: string) => void;
  para: (text: string) => void;
  /** Ends the document; resolves with its bytes. */
  end: () => Promise<Buffer>;
}

/** pdfkit, built-in Helvetica, WinAnsi text (see pdfText). */
export function pdfWriter(language: Language, title: string): PdfWriter {
  const w = wordsFor(language);
  const p = pdfText;
  const doc = new PDFDocument({ size: 'A4', margin: 48, lang: language, info: { Title: p(title), Author: 'Broodcast', Subject: p(w.t('pdfSubject')) } });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (x: Buffer) => chunks.push(x));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  return {
    doc, w, left, width,
    heading: (text: string) => {
      if (doc.y > doc.page.height - 140) doc.addPage();
      doc.moveDown(0.8).font('Helvetica-Bold').fontSize(13).fillColor('#1d2026').text(p(text), left);
      doc.moveDown(0.2).font('Helvetica').fontSize(10);
    },
    para: (text: string) => void doc.font('Helvetica').fontSize(10).fillColor('#1d2026').text(p(text), left, undefined, { width }),
    end: () => {
      doc.end();
      return done;
    },
  };
}

/** One district's part of a PDF bulletin: title, tier badge, drivers, cases chart, tier history, advisories, what to do. */
export function drawDistrictPdf(pw: PdfWriter, d: BulletinData, titleSize = 18): void {
  const { doc, w, left, width, heading, para } = pw;
  const { t, c } = w;
  const p = pdfText;
  if (doc.y > doc.page.height - 200) doc.addPage();
  doc.font('Helvetica-Bold').fontSize(titleSize).fillColor('#1d2026').text(p(t('title', { district: d.district.name, code: d.district.code })), left);
  doc.font('Helvetica').fontSize(10).fillColor('#555555').text(p(`${weekLine(d, w)}${d.district.isDemo ? `. ${t('demoShort')}.` : ''}`));
  doc.moveDown(0.6);
  if (d.tier) {
    const y = doc.y;
    doc.rect(left, y, 90, 20).fillAndStroke(TIER_FILL[d.tier.tier], '#3f1239');
    doc.fillColor(TIER_INK[d.tier.tier]).font('Helvetica-Bold').fontSize(11).text(p(w.tier(d.tier.tier)), left, y + 5, { width: 90, align: 'center' });
    doc.y = y + 28;
  }
  para(tierSentence(d, w));

  if (d.tier) {
    heading(t('driversHeading'));
    for (const dr of d.tier.drivers) {
      const y = doc.y;
      doc.fillColor('#1d2026').text(p(driverName(dr, w)), left, y, { width: 150 });
      const below = doc.y;
      doc.rect(left + 160, y + 1, 200, 9).stroke('#999999');
      if (dr.score !== null) doc.rect(left + 160, y + 1, 200 * Math.min(1, dr.score), 9).fill('#94508a');
      doc.fillColor('#1d2026').text(p(dr.score === null ? t('noData') : t('driverPdfLine', { score: w.score(dr.score), share: w.pct(shareOf(d.tier.drivers, dr.id)) })), left + 370, y, { width: width - 370 });
      doc.y = Math.max(doc.y, below, y + 14);
    }
  }

  const main = d.cases[0];
  if (main) {
    heading(t('casesHeadingFor', { disease: main.diseaseName }));
    drawCasesChart(doc, main.weeks, left, doc.y, width, 150, w);
    for (const wk of recentWeeks(main.weeks)) para(`${t('caseLinePdf', caseVars(wk, w))}${zoneWord(wk, w) ? ` (${zoneWord(wk, w)})` : ''}`);
    for (const other of d.cases.slice(1)) {
      const last = other.weeks[other.weeks.length - 1];
      if (last) para(t('caseLineOther', { disease: other.diseaseName, ...caseVars(last, w) }));
    }
  } else {
    heading(t('casesHeading'));
    para(t('noCases'));
  }

  if (d.tierHistory.length > 1) {
    heading(t('chart.tierHeading'));
    drawTierHistory(doc, d.tierHistory, left, doc.y, width, 70, w);
  }

  heading(t('advisoriesHeading'));
  if (d.advisories.length === 0) para(t('none'));
  for (const a of d.advisories) para(advisoryLine(a, w));

  heading(c('whatToDo'));
  for (const a of d.actions) {
    const x = actionIn(w.language, a);
    doc.font('Helvetica-Bold').text(p(`${x.title}. `), left, undefined, { continued: true, width }).font('Helvetica').text(p(x.text));
    doc.moveDown(0.2);
  }
  doc.font('Helvetica-Oblique').text(p(c('actionCaution')), left, undefined, { width });
}

/** The region's ranking in a PDF bulletin (marked rows in bold). */
export function drawRankingPdf(pw: PdfWriter, ranking: RankingRow[], heading: string): void {
  const { doc, w, left, width } = pw;
  pw.heading(heading);
  const { rows, omitted } = rankingExcerpt(ranking);
  for (const r of rows) {
    doc.font(r.isThis ? 'Helvetica-Bold' : 'Helvetica').fillColor('#1d2026')
      .text(pdfText(w.t('regionLinePdf', { rank: r.rank, district: r.name, code: r.code, tier: rankTier(r, w), score: w.score(r.score) })), left, undefined, { width });
  }
  if (omitted > 0) doc.font('Helvetica-Oblique').fillColor('#555555').text(pdfText(w.t('regionOmitted', { count: omitted })), left, undefined, { width });
}

export function drawCautionsPdf(pw: PdfWriter): void {
  pw.heading(pw.w.c('keepInMind'));
  for (const x of cautionsFor(pw.w.language)) {
    pw.para(`- ${x}`);
    pw.doc.moveDown(0.2);
  }
}

/** The PDF bulletin of one district in `language`: the same content, with the cases chart and tier history drawn as vector graphics. */
export function bulletinPdf(d: BulletinData, language: Language = DEFAULT_LANGUAGE): Promise<Buffer> {
  const pw = pdfWriter(language, bulletinSubject(d, language));
  drawDistrictPdf(pw, d);
  drawRankingPdf(pw, d.ranking, pw.w.t('regionHeading'));
  drawCautionsPdf(pw);
  return pw.end();
}

function drawCasesChart(doc: PDFKit.PDFDocument, weeks: CaseWeek[], x0: number, y0: number, width: number, height: number, w: Words) {
  const n = Math.max(1, weeks.length);
  const max = Math.max(1, ...weeks.map((w) => Math.max(w.count ?? 0, w.upper ?? 0)));
  const plotH = height - 20;
  const x = (i: number) => x0 + 30 + (i * (width - 40)) / n;
  const y = (v: number) => y0 + plotH - (v / max) * plotH;
  const bw = Math.max(1, (width - 40) / n - 1.5);
  const band = weeks.map((w, i) => ({ w, i })).filter(({ w }) => w.upper !== null && w.lower !== null);
  if (band.length > 1) {
    doc.save();
    doc.moveTo(x(band[0].i) + bw / 2, y(band[0].w.upper!));
    for (const { w, i } of band.slice(1)) doc.lineTo(x(i) + bw / 2, y(w.upper!));
    for (const { w, i } of [...band].reverse()) doc.lineTo(x(i) + bw / 2, y(w.lower!));
    doc.closePath().fillOpacity(0.6).fill('#d2a6c8');
    doc.restore();
  }
  weeks.forEach((w, i) => {
    if (w.count !== null && w.count > 0) doc.rect(x(i), y(w.count), bw, (w.count / max) * plotH).fill('#3f1239');
  });
  doc.moveTo(x0 + 30, y0 + plotH).lineTo(x0 + width - 10, y0 + plotH).stroke('#555555');
  doc.moveTo(x0 + 30, y0).lineTo(x0 + 30, y0 + plotH).stroke('#555555');
  doc.font('Helvetica').fontSize(8).fillColor('#555555');
  doc.text(pdfText(w.num(Math.round(max))), x0, y0 - 3, { width: 26, align: 'right' });
  doc.text('0', x0, y0 + plotH - 4, { width: 26, align: 'right' });
  doc.text(pdfText(w.t('chart.week', { week: 1 })), x0 + 30, y0 + plotH + 4);
  doc.text(pdfText(w.t('chart.week', { week: weeks.length })), x0 + width - 60, y0 + plotH + 4, { width: 50, align: 'right' });
  doc.text(pdfText(w.t('chart.legend')), x0 + 80, y0 + plotH + 4, { width: width - 160, align: 'center' });
  doc.y = y0 + height + 6;
  doc.fontSize(10).fillColor('#1d2026');
}

function drawTierHistory(doc: PDFKit.PDFDocument, history: BulletinData['tierHistory'], x0: number, y0: number, width: number, height: number, w: Words) {
  const n = Math.max(1, history.length);
  const plotH = height - 16;
  const bw = Math.max(1, (width - 40) / n - 1.5);
  history.forEach((h, i) => {
    const bx = x0 + 30 + (i * (width - 40)) / n;
    const bh = Math.max(1, h.score * plotH);
    doc.rect(bx, y0 + plotH - bh, bw, bh).fillAndStroke(TIER_FILL[h.tier], '#3f1239');
  });
  doc.font('Helvetica').fontSize(8).fillColor('#555555');
  doc.text('1', x0, y0 - 3, { width: 26, align: 'right' });
  doc.text('0', x0, y0 + plotH - 4, { width: 26, align: 'right' });
  const last = history[history.length - 1];
  doc.text(pdfText(w.t('chart.tierLegend', { week: last.week, tier: w.tier(last.tier) })), x0 + 30, y0 + plotH + 4, { width: width - 40 });
  doc.y = y0 + height + 6;
  doc.fontSize(10).fillColor('#1d2026');
}
