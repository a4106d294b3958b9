import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { composeMessage, messageCodeOf } from '../../shared/flags/advisory-message';
import { driverShares } from '../../shared/tier/driver-shares';
import { renderMessage } from '../../server/flags/flag-texts';

const d = (contributions: Partial<Record<'climate' | 'vectorClock' | 'larval' | 'cases', number>>, climate: Record<string, unknown> = {}) =>
  (['climate', 'vectorClock', 'larval', 'cases'] as const).map((id) => ({
    id, contribution: contributions[id] ?? 0, score: contributions[id] === undefined ? null : contributions[id]! * 3, detail: id === 'climate' ? climate : {},
  }));
const base = { district: 'Saltmere', reason: 'tier-rise' as const, tier: 'high' as const, previousTier: 'raised' as const, epiYear: 2026, epiWeek: 40 };

describe('driver shares (the one computation quoted on cards, in messages and in bulletins)', () => {
  it('when contributions are 0.25 and 0.075, then the shares are 77 % and 23 % of the score, never the 25 % of the raw contribution', () => {
    // derived: 0.25 / 0.325 = 76.9 %, 0.075 / 0.325 = 23.1 %
    expect(driverShares(d({ cases: 0.25, climate: 0.075 })).map((s) => [s.id, s.share])).toEqual([['cases', 0.77], ['climate', 0.23]]);
  });
  it('when three equal drivers share a score, then the rounded shares still add up to 100 %', () => {
    // Largest-remainder (Hamilton) apportionment: 33.3 % each rounds to 34 + 33 + 33; common practice.
    const shares = driverShares(d({ climate: 0.1, vectorClock: 0.1, larval: 0.1 }));
    expect(shares.reduce((a, s) => a + Math.round(s.share * 100), 0)).toBe(100);
  });
  it('when no driver adds anything, then there are no shares', () => {
    expect(driverShares(d({ climate: 0 }))).toEqual([]);
  });
});

describe('message codes from the numbers', () => {
  it.each([
    ['the profile\'s season window is shut', d({ climate: 0, cases: 0.1 }, { seasonOpen: false }), 'diapause'],
    ['climate suitability is zero', d({ climate: 0, larval: 0.1 }, { seasonOpen: true, rvc14: 0 }), 'zero-suitability'],
    ['no driver has data', d({}), 'no-signal'],
    ['only cases add to the score', d({ cases: 0.3 }), 'case-signal-only'],
    ['cases carry most of it', d({ cases: 0.3, climate: 0.1 }), 'case-led'],
    ['weather drivers carry most of it', d({ climate: 0.2, vectorClock: 0.15, cases: 0.1 }), 'weather-led'],
    ['larval indices carry most of it', d({ larval: 0.3, climate: 0.05, cases: 0.05 }), 'larval-led'],
    ['no group carries half', d({ climate: 0.1, larval: 0.1, cases: 0.1 }), 'mixed'],
  ])('when %s, then the code is the matching one', (_what, drivers, code) => {
    expect(messageCodeOf(drivers)).toBe(code);
  });

  it('when each code is worded, then each has its own sentence and only the mosquito-led ones say conditions favour mosquitoes', () => {
    const words = new Set<string>();
    for (const drivers of [d({ climate: 0, cases: 0.1 }, { seasonOpen: false }), d({ climate: 0, larval: 0.1 }), d({}), d({ cases: 0.3 }), d({ cases: 0.3, climate: 0.1 }),
      d({ climate: 0.2, vectorClock: 0.15 }), d({ larval: 0.3, cases: 0.05 }), d({ climate: 0.1, larval: 0.1, cases: 0.1 })]) {
      const m = composeMessage({ ...base, drivers });
      const text = renderMessage(m.code, m.params, 'en');
      words.add(text.split('. ').find((s) => !s.startsWith("Broodcast's weekly")) ?? '');
      expect(/Conditions favour mosquitoes/.test(text), `${m.code}: ${text}`).toBe(['weather-led', 'larval-led', 'mixed'].includes(m.code));
    }
    expect(words.size).toBe(8);
  });

  it('when a message is worded in French, then it uses the narrow no-break space before ":" and ";" and the French percent', () => {
    const m = composeMessage({ ...base, drivers: d({ cases: 0.25, climate: 0.075 }) });
    const fr = renderMessage(m.code, m.params, 'fr');
    // The percent's space is Intl's own (a no-break space, narrow or not by the runtime's CLDR).
    expect(fr.replace(/(\d)[\u00a0\u202f]%/g, '$1 %')).toContain('Ce qui pèse le plus cette semaine\u202f: Signal des cas (77 % du score) et Conditions climatiques favorables (23 %).');
    expect(fr).not.toMatch(/[^\u202f][:;]/);
  });
});

describe('the same words on both sides', () => {
  it('when the client and the server word a message, then their message texts are identical in every language', () => {
    for (const l of ['en', 'fr', 'es', 'pt']) {
      const server = JSON.parse(readFileSync(`server/i18n/locales/${l}/flags.json`, 'utf8')).message;
      const client = JSON.parse(readFileSync(`src/i18n/locales/${l}/flags.json`, 'utf8')).message;
      expect(client, l).toEqual(server);
    }
  });
});

describe('what weighs most, only where something does', () => {
  it('when a Baseline district with no cases is flagged by hand, then the message names no driver as weighing most', () => {
    // Found walking the product: "What weighs most this week: Case signal (100% of the score)" for 0 cases.
    const m = composeMessage({ ...base, reason: 'manual', tier: 'baseline', previousTier: null, drivers: d({ cases: 0.12 }) });
    expect(m.params.shares).toEqual([{ id: 'cases', share: 1 }]);
    expect(renderMessage(m.code, m.params, 'en')).not.toMatch(/weighs most|% of the score/);
    const high = composeMessage({ ...base, drivers: d({ cases: 0.3, climate: 0.1 }) });
    expect(renderMessage(high.code, high.params, 'en')).toMatch(/75\s?% of the score/);
  });
});
