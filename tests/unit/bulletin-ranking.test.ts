import { describe, expect, it } from 'vitest';
import { RANKING_TOP, rankingExcerpt, rankingHtml, rankingTextLines, wordsFor, type RankingRow } from '../../server/bulletins/bulletin.render';

// A national ranking in every mail made each bulletin about 2 MB; a mail prints the top and the reader's own.
const row = (i: number, isThis = false): RankingRow => ({ rank: i + 1, code: `C-${i + 1}`, name: `District ${i + 1}`, tier: 'baseline', score: 0.1, confidence: 'high', isThis });

describe('the ranking a bulletin prints', () => {
  it('when the region has 3,000 districts and the reader follows two far down, then the mail lists the top 20 and those two, and says how many are left out', () => {
    const ranking = Array.from({ length: 3000 }, (_, i) => row(i, i === 1500 || i === 2999));
    const { rows, omitted } = rankingExcerpt(ranking);
    expect(rows.map((r) => r.rank)).toEqual([...Array.from({ length: RANKING_TOP }, (_, i) => i + 1), 1501, 3000]);
    expect(omitted).toBe(3000 - RANKING_TOP - 2);
    const w = wordsFor('en');
    const text = rankingTextLines(ranking, w, '←');
    expect(text[0]).toBe(w.t('regionHeadingCount', { count: 3000 }));
    expect(text.at(-1)).toBe('… and 2,978 other districts, on the Ladder.'.replace('2,978', String(2978)));
    const html = rankingHtml(ranking, wordsFor('fr'), 'x').join('\n');
    expect(html.match(/<tr/g)).toHaveLength(1 + RANKING_TOP + 2);
    expect(html).toContain('autres districts, sur le Classement.');
    expect(html.length).toBeLessThan(20_000);
  });

  it('when the region has 12 districts, then all are listed and nothing is said to be left out', () => {
    const ranking = Array.from({ length: 12 }, (_, i) => row(i, i === 3));
    expect(rankingExcerpt(ranking)).toEqual({ rows: ranking, omitted: 0 });
    expect(rankingTextLines(ranking, wordsFor('en'), '←')).toHaveLength(13);
  });

  it('when a district has too little data for a tier, then the ranking says it is not estimated instead of calling it Baseline', () => {
    // Found walking the product: imported districts without weather were mailed as "Baseline 0.00".
    const ranking = [row(0), { ...row(1), confidence: 'insufficient' }];
    const text = rankingTextLines(ranking, wordsFor('en'), '←').join('\n');
    expect(text).toContain('District 2 (C-2) — not estimated (not enough data)');
    expect(text).toContain('District 1 (C-1) — Baseline');
    expect(rankingHtml(ranking, wordsFor('pt'), 'x').join('')).toContain('não estimado (dados insuficientes)');
  });
});
