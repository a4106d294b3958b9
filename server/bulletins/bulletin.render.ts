import PDFDocument from 'pdfkit';
import { ACTION_CAUTION } from '../../shared/api/flags.schema';
import { TIER_LABELS, type Tier } from '../../shared/tier';
import type { BulletinData, CaseWeek } from './bulletin-data';
import { MAIL_CAUTIONS, escapeHtml } from './bulletin-texts';

/**
 * The same sequential single-hue tier scale as the client's (src/features/ladder/tier-scale.ts): it keeps
 * its order in grayscale, and every tier is also written as a word.
 */
const TIER_FILL: Record<Tier, string> = { baseline: '#f3e9f1', raised: '#d2a6c8', high: '#94508a', critical: '#3f1239' };
const TIER_INK: Record<Tier, string> = { baseline: '#1d2026', raised: '#1d2026', high: '#ffffff', critical: '#ffffff' };

const fmt = (x: number | null | undefined, digits = 0) => (x === null || x === undefined ? '-' : x.toFixed(digits));
const pct = (x: number) => `${Math.round(x * 100)}%`;
const CONFIDENCE_WORDS: Record<string, string> = {
  ok: '',
  stale: ' (inputs are out of date: read with care)',
  insufficient: ' (not enough data to estimate)',
};

export function bulletinSubject(d: BulletinData): string {
  const tier = d.tier ? `${TIER_LABELS[d.tier.tier]} tier` : 'no tier yet';
  return `Broodcast weekly bulletin: ${d.district.name}, week ${d.epiWeek} of ${d.epiYear} (${tier})`;
}

function tierSentence(d: BulletinData): string {
  if (!d.tier) return 'The season run has not estimated a tier for this district this week.';
  const range = d.tier.tierLow !== d.tier.tierHigh ? ` The estimate ranges from ${TIER_LABELS[d.tier.tierLow]} to ${TIER_LABELS[d.tier.tierHigh]} across the low and high parameter sets.` : '';
  return `${d.district.name} is at the ${TIER_LABELS[d.tier.tier]} tier (score ${d.tier.score.toFixed(2)} of 1)${CONFIDENCE_WORDS[d.tier.confidence] ?? ''}.${range}`;
}

const recentWeeks = (weeks: CaseWeek[], n = 6) => weeks.slice(Math.max(0, weeks.length - n));
const zoneWord = (w: CaseWeek) =>
  w.count === null || w.upper === null ? '' : w.count > w.upper ? 'above the channel' : w.lower !== null && w.count < w.lower ? 'below the channel' : 'within the channel';

/** The plain-text bulletin (the footer with the recipient's own links is added per recipient). */
export function bulletinText(d: BulletinData): string {
  const out: string[] = [
    `BROODCAST WEEKLY BULLETIN — ${d.district.name} (${d.district.code}), week ${d.epiWeek} of ${d.epiYear}`,
    d.district.isDemo ? 'Demo data: this district and its numbers are invented.' : '',
    '',
    tierSentence(d),
    '',
  ];
  if (d.tier) {
    out.push('Drivers behind the tier');
    for (const dr of d.tier.drivers) out.push(`- ${dr.label}: ${dr.score === null ? 'no data (weight shared among the others)' : `score ${dr.score.toFixed(2)}, weight ${dr.weight}, ${pct(dr.contribution)} of the score`}`);
    for (const n of d.tier.notes) out.push(`  Note: ${n}`);
    out.push('');
  }
  out.push('Cases against the endemic channel (recent weeks)');
  if (d.cases.length === 0) out.push('- No case counts reported for this district this season.');
  for (const c of d.cases) {
    out.push(`${c.diseaseName}:`);
    for (const w of recentWeeks(c.weeks)) out.push(`  week ${w.week}: ${fmt(w.count)} cases; usual range ${fmt(w.lower, 1)} to ${fmt(w.upper, 1)}${zoneWord(w) ? ` (${zoneWord(w)})` : ''}`);
  }
  out.push('', 'Open advisories');
  if (d.advisories.length === 0) out.push('- None.');
  for (const a of d.advisories) out.push(`- ${a.issuedAt.slice(0, 10)}${a.tier ? ` (${TIER_LABELS[a.tier]})` : ''}: ${a.message}`);
  out.push('', 'What to do');
  for (const a of d.actions) out.push(`- ${a.title}: ${a.text}`);
  out.push(`  ${ACTION_CAUTION}`, '', `The region this week (${d.ranking.length} districts, highest first)`);
  for (const r of d.ranking) out.push(`${String(r.rank).padStart(3)}. ${r.name} (${r.code}) — ${TIER_LABELS[r.tier]}, ${r.score.toFixed(2)}${r.isThis ? '  <- this district' : ''}`);
  out.push('', 'Please keep in mind', ...MAIL_CAUTIONS.map((c) => `- ${c}`));
  return out.filter((l, i, a) => !(l === '' && a[i - 1] === '')).join('\n');
}

/** A small inline SVG: this season's weekly cases as bars over the channel band (mail programs that drop SVG still have the table). */
function casesSvg(weeks: CaseWeek[]): string {
  const W = 520, H = 140, pad = 24;
  const max = Math.max(1, ...weeks.map((w) => Math.max(w.count ?? 0, w.upper ?? 0)));
  const x = (i: number) => pad + (i * (W - 2 * pad)) / Math.max(1, weeks.length);
  const y = (v: number) => H - pad - (v / max) * (H - 2 * pad);
  const bw = Math.max(1, (W - 2 * pad) / Math.max(1, weeks.length) - 2);
  const band = weeks.filter((w) => w.upper !== null && w.lower !== null);
  const top = band.map((w) => `${x(w.week - 1) + bw / 2},${y(w.upper!)}`);
  const bottom = [...band].reverse().map((w) => `${x(w.week - 1) + bw / 2},${y(w.lower!)}`);
  const bars = weeks.map((w, i) => (w.count === null ? '' : `<rect x="${x(i)}" y="${y(w.count)}" width="${bw}" height="${H - pad - y(w.count)}" fill="#3f1239"/>`)).join('');
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" role="img" aria-label="Weekly cases against the usual range">
${band.length > 1 ? `<polygon points="${[...top, ...bottom].join(' ')}" fill="#d2a6c8" fill-opacity="0.6"/>` : ''}${bars}
<line x1="${pad}" y1="${H - pad}" x2="${W - pad}" y2="${H - pad}" stroke="#555"/>
<text x="${pad}" y="${H - 6}" font-size="10" fill="#555">week 1</text><text x="${W - pad}" y="${H - 6}" font-size="10" fill="#555" text-anchor="end">week ${weeks.length}</text>
<text x="${pad}" y="12" font-size="10" fill="#555">max ${Math.round(max)} cases; shaded: usual range (endemic channel)</text></svg>`;
}

const td = 'style="padding:3px 8px;border-bottom:1px solid #ddd;text-align:left"';

/** The HTML bulletin, with inline styles only (mail programs drop style sheets). */
export function bulletinHtml(d: BulletinData): string {
  const badge = (t: Tier) => `<span style="background:${TIER_FILL[t]};color:${TIER_INK[t]};padding:1px 6px;border-radius:3px;border:1px solid #3f1239">${TIER_LABELS[t]}</span>`;
  const parts: string[] = [
    `<!doctype html><html><body style="font-family:Arial,Helvetica,sans-serif;color:#1d2026;max-width:680px">`,
    `<h1 style="font-size:20px;margin-bottom:4px">Weekly bulletin: ${escapeHtml(d.district.name)} (${escapeHtml(d.district.code)})</h1>`,
    `<p style="margin-top:0;color:#555">Week ${d.epiWeek} of ${d.epiYear}${d.asOf ? `, data up to ${d.asOf}` : ''}${d.district.isDemo ? ' · <strong>Demo data: invented district and numbers</strong>' : ''}</p>`,
    `<p>${d.tier ? badge(d.tier.tier) + ' ' : ''}${escapeHtml(tierSentence(d))}</p>`,
  ];
  if (d.tier) {
    parts.push(`<h2 style="font-size:16px">Drivers behind the tier</h2><table style="border-collapse:collapse"><tr><th ${td}>Driver</th><th ${td}>Score</th><th ${td}>Weight</th><th ${td}>Share of the score</th></tr>`);
    for (const dr of d.tier.drivers)
      parts.push(`<tr><td ${td}>${escapeHtml(dr.label)}</td><td ${td}>${dr.score === null ? 'no data' : dr.score.toFixed(2)}</td><td ${td}>${dr.weight}</td><td ${td}>${pct(dr.contribution)}</td></tr>`);
    parts.push('</table>');
    if (d.tier.notes.length) parts.push(`<ul style="font-size:13px;color:#555">${d.tier.notes.map((n) => `<li>${escapeHtml(n)}</li>`).join('')}</ul>`);
  }
  parts.push('<h2 style="font-size:16px">Cases against the endemic channel</h2>');
  if (d.cases.length === 0) parts.push('<p>No case counts reported for this district this season.</p>');
  for (const c of d.cases) {
    parts.push(`<h3 style="font-size:14px">${escapeHtml(c.diseaseName)}</h3>${casesSvg(c.weeks)}`);
    parts.push(`<table style="border-collapse:collapse"><tr><th ${td}>Week</th><th ${td}>Cases</th><th ${td}>Usual range</th><th ${td}></th></tr>`);
    for (const w of recentWeeks(c.weeks)) parts.push(`<tr><td ${td}>${w.week}</td><td ${td}>${fmt(w.count)}</td><td ${td}>${fmt(w.lower, 1)} to ${fmt(w.upper, 1)}</td><td ${td}>${zoneWord(w)}</td></tr>`);
    parts.push('</table>');
  }
  parts.push('<h2 style="font-size:16px">Open advisories</h2>');
  parts.push(d.advisories.length === 0 ? '<p>None.</p>' : `<ul>${d.advisories.map((a) => `<li><strong>${a.issuedAt.slice(0, 10)}${a.tier ? ` (${TIER_LABELS[a.tier]})` : ''}:</strong> ${escapeHtml(a.message)}</li>`).join('')}</ul>`);
  parts.push(`<h2 style="font-size:16px">What to do</h2><ul>${d.actions.map((a) => `<li><strong>${escapeHtml(a.title)}.</strong> ${escapeHtml(a.text)}</li>`).join('')}</ul><p><em>${escapeHtml(ACTION_CAUTION)}</em></p>`);
  parts.push(`<h2 style="font-size:16px">The region this week</h2><table style="border-collapse:collapse"><tr><th ${td}>Rank</th><th ${td}>District</th><th ${td}>Tier</th><th ${td}>Score</th></tr>`);
  for (const r of d.ranking)
    parts.push(`<tr${r.isThis ? ' style="font-weight:bold"' : ''}><td ${td}>${r.rank}</td><td ${td}>${escapeHtml(r.name)} (${escapeHtml(r.code)})</td><td ${td}>${badge(r.tier)}</td><td ${td}>${r.score.toFixed(2)}</td></tr>`);
  parts.push('</table>');
  parts.push(`<h2 style="font-size:16px">Please keep in mind</h2><ul>${MAIL_CAUTIONS.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul>`);
  parts.push('<!--footer--></body></html>');
  return parts.join('\n');
}

/** The per-recipient footer goes where the HTML bulletin leaves room for it. */
export const withFooter = (html: string, footerHtml: string) => html.replace('<!--footer-->', footerHtml);

/** The PDF bulletin (pdfkit, built-in Helvetica): the same content, with the cases chart and tier history drawn as vector graphics. */
export function bulletinPdf(d: BulletinData): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: 'A4', margin: 48, info: { Title: bulletinSubject(d), Author: 'Broodcast', Subject: 'Weekly bulletin' } });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    const left = doc.page.margins.left;
    const width = doc.page.width - left - doc.page.margins.right;
    const heading = (text: string) => {
      if (doc.y > doc.page.height - 140) doc.addPage();
      doc.moveDown(0.8).font('Helvetica-Bold').fontSize(13).fillColor('#1d2026').text(text, left);
      doc.moveDown(0.2).font('Helvetica').fontSize(10);
    };
    const para = (text: string) => doc.font('Helvetica').fontSize(10).fillColor('#1d2026').text(text, left, undefined, { width });

    doc.font('Helvetica-Bold').fontSize(18).text(`Weekly bulletin: ${d.district.name} (${d.district.code})`);
    doc.font('Helvetica').fontSize(10).fillColor('#555555')
      .text(`Week ${d.epiWeek} of ${d.epiYear}${d.asOf ? `, data up to ${d.asOf}` : ''}${d.district.isDemo ? '. Demo data: invented district and numbers.' : ''}`);
    doc.moveDown(0.6);
    if (d.tier) {
      const y = doc.y;
      doc.rect(left, y, 90, 20).fillAndStroke(TIER_FILL[d.tier.tier], '#3f1239');
      doc.fillColor(TIER_INK[d.tier.tier]).font('Helvetica-Bold').fontSize(11).text(TIER_LABELS[d.tier.tier], left, y + 5, { width: 90, align: 'center' });
      doc.y = y + 28;
    }
    para(tierSentence(d));

    if (d.tier) {
      heading('Drivers behind the tier');
      for (const dr of d.tier.drivers) {
        const y = doc.y;
        doc.fillColor('#1d2026').text(dr.label, left, y, { width: 150 });
        doc.rect(left + 160, y + 1, 200, 9).stroke('#999999');
        if (dr.score !== null) doc.rect(left + 160, y + 1, 200 * Math.min(1, dr.score), 9).fill('#94508a');
        doc.fillColor('#1d2026').text(dr.score === null ? 'no data' : `score ${dr.score.toFixed(2)}, ${pct(dr.contribution)} of the tier score`, left + 370, y, { width: width - 370 });
        doc.y = Math.max(doc.y, y + 14);
      }
    }

    const main = d.cases[0];
    if (main) {
      heading(`Cases against the endemic channel: ${main.diseaseName}`);
      drawCasesChart(doc, main.weeks, left, doc.y, width, 150);
      for (const w of recentWeeks(main.weeks)) para(`Week ${w.week}: ${fmt(w.count)} cases; usual range ${fmt(w.lower, 1)} to ${fmt(w.upper, 1)}${zoneWord(w) ? ` (${zoneWord(w)})` : ''}`);
      for (const other of d.cases.slice(1)) {
        const last = other.weeks[other.weeks.length - 1];
        if (last) para(`${other.diseaseName}, week ${last.week}: ${fmt(last.count)} cases; usual range ${fmt(last.lower, 1)} to ${fmt(last.upper, 1)}`);
      }
    } else {
      heading('Cases against the endemic channel');
      para('No case counts reported for this district this season.');
    }

    if (d.tierHistory.length > 1) {
      heading('Tier score this season');
      drawTierHistory(doc, d.tierHistory, left, doc.y, width, 70);
    }

    heading('Open advisories');
    if (d.advisories.length === 0) para('None.');
    for (const a of d.advisories) para(`${a.issuedAt.slice(0, 10)}${a.tier ? ` (${TIER_LABELS[a.tier]})` : ''}: ${a.message}`);

    heading('What to do');
    for (const a of d.actions) {
      doc.font('Helvetica-Bold').text(`${a.title}. `, left, undefined, { continued: true, width }).font('Helvetica').text(a.text);
      doc.moveDown(0.2);
    }
    doc.font('Helvetica-Oblique').text(ACTION_CAUTION, left, undefined, { width });

    heading('The region this week');
    for (const r of d.ranking) {
      doc.font(r.isThis ? 'Helvetica-Bold' : 'Helvetica').fillColor('#1d2026')
        .text(`${r.rank}. ${r.name} (${r.code}): ${TIER_LABELS[r.tier]}, score ${r.score.toFixed(2)}`, left, undefined, { width });
    }

    heading('Please keep in mind');
    for (const c of MAIL_CAUTIONS) {
      para(`- ${c}`);
      doc.moveDown(0.2);
    }
    doc.end();
  });
}

function drawCasesChart(doc: PDFKit.PDFDocument, weeks: CaseWeek[], x0: number, y0: number, width: number, height: number) {
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
  doc.text(String(Math.round(max)), x0, y0 - 3, { width: 26, align: 'right' });
  doc.text('0', x0, y0 + plotH - 4, { width: 26, align: 'right' });
  doc.text('week 1', x0 + 30, y0 + plotH + 4);
  doc.text(`week ${weeks.length}`, x0 + width - 60, y0 + plotH + 4, { width: 50, align: 'right' });
  doc.text('Bars: weekly cases. Shaded: the usual range for the week (endemic channel).', x0 + 80, y0 + plotH + 4, { width: width - 160, align: 'center' });
  doc.y = y0 + height + 6;
  doc.fontSize(10).fillColor('#1d2026');
}

function drawTierHistory(doc: PDFKit.PDFDocument, history: BulletinData['tierHistory'], x0: number, y0: number, width: number, height: number) {
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
  doc.text(`Weekly tier score (0 to 1), shaded by tier; latest week ${last.week}: ${TIER_LABELS[last.tier]}.`, x0 + 30, y0 + plotH + 4, { width: width - 40 });
  doc.y = y0 + height + 6;
  doc.fontSize(10).fillColor('#1d2026');
}
