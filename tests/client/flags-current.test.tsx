import { afterEach, describe, expect, it, vi } from 'vitest';
import { i18n } from '../../src/i18n';
import { demoDistricts, fakeApi, json } from './support/fake-api';
import { waitFor, type Rendered, renderRoutes } from './support/render';

/** Issue 16 items 3–4 and issue 21, as a supervisor and a French community worker meet them. */
const district = demoDistricts[0];
const uuid = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const drivers = (c: Record<string, number>) =>
  ['climate', 'vectorClock', 'larval', 'cases'].map((id) => ({ id, label: id, score: c[id] ?? null, weight: 0.25, contribution: c[id] ?? 0, detail: {} }));
const params = { district: district.name, reason: 'tier-rise', tier: 'critical', previousTier: null, epiYear: 2026, epiWeek: 40, shares: [{ id: 'cases', share: 0.77 }, { id: 'climate', share: 0.23 }] };

const flag = (over: Record<string, unknown>) => ({
  id: uuid(500), districtId: district.id, districtCode: district.code, districtName: district.name, reason: 'tier-rise', source: 'season-run',
  status: 'open', tier: 'critical', previousTier: null, epiYear: 2026, epiWeek: 40, drivers: drivers({ cases: 0.25, climate: 0.075 }),
  suggestedMessage: 'English text kept for the record', message: { code: 'case-led', params }, proposal: { code: 'case-led', params },
  actions: [{ id: 'case-finding', title: 'Look actively for cases', text: 'x' }], caution: 'c', note: null, publicMessage: null,
  current: { tier: 'high', epiYear: 2026, epiWeek: 42, computedAt: '2026-10-20T02:00:00.000Z', drivers: drivers({ cases: 0.5 }) },
  superseded: true, lapsesAt: '2026-10-17T09:00:00.000Z', raisedBy: null, createdAt: '2026-10-03T09:00:00.000Z', decidedBy: null, decidedAt: null,
  decisionReason: null, finalMessage: null, finalComposed: null, advisoryId: null, version: 1, ...over,
});

let view: Rendered | undefined;
afterEach(async () => {
  vi.unstubAllGlobals();
  await i18n.changeLanguage('en');
});

describe('the sign-off queue stays current', () => {
  it('when a flag is superseded, then its card shows the tier that raised it, the tier now with its week, and the shares from the one computation; lapsed flags are listed apart', async () => {
    const proposal = { code: 'case-led', params: { ...params, tier: 'high', epiWeek: 42, flag: { raisedOn: '2026-10-03', epiYear: 2026, epiWeek: 40, tier: 'critical' } } };
    const supervisor = { id: uuid(104), email: 's@halvern.example', displayName: 'Sam Supervisor', role: 'supervisor', districts: [], preferences: { language: 'en', temperatureUnit: 'C', rainUnit: 'mm' } };
    // Both lists answer from the same handler: the status query decides which.
    vi.stubGlobal('fetch', vi.fn(async (input: string | URL | Request) => {
      const url = new URL(typeof input === 'string' ? input : input instanceof URL ? input.href : input.url, 'http://localhost');
      if (url.pathname === '/api/me') return json(200, supervisor);
      if (url.pathname === '/api/flags' && url.searchParams.get('status') === 'lapsed')
        return json(200, { flags: [flag({ id: uuid(501), status: 'lapsed', superseded: false, lapsesAt: null, districtName: 'Old Quay' })], lapseWeeks: 2 });
      if (url.pathname === '/api/flags') return json(200, { flags: [flag({ proposal })], lapseWeeks: 2 });
      return json(404, { error: { code: 'not_found', message: 'x' } });
    }));
    view = await renderRoutes('/sign-off');
    const queue = await waitFor(() => {
      const list = view!.container.querySelector('ol[aria-label="Flags waiting for sign-off"]');
      if (!list) throw new Error('no queue yet');
      return list as HTMLElement;
    }, 3000);
    const tiers = queue.querySelector('[data-testid="flag-tiers"]')!.textContent!;
    expect(tiers).toMatch(/Tier that raised it\s*Critical.*week 40 of 2026/);
    expect(tiers).toMatch(/Tier now\s*High.*week 42 of 2026/);
    expect(queue.textContent).toContain('Superseded: a newer season run');
    expect(queue.textContent).toContain('Case signal 77%');
    expect(queue.textContent).not.toContain('Case signal 25%');
    const textarea = queue.querySelector('textarea')!;
    expect(textarea.value).toContain('Case signal (77% of the score)');
    expect(textarea.value).toContain('for week 40 of 2026 at the Critical tier; it uses the district\'s estimate for week 42 of 2026');
    const lapsed = await waitFor(() => {
      const list = view!.container.querySelector('[data-testid="lapsed-flags"]');
      if (!list) throw new Error('no lapsed list yet');
      return list as HTMLElement;
    }, 3000);
    expect(lapsed.textContent).toContain('Old Quay');
    expect(lapsed.textContent).toContain('This flag has lapsed: it can only be rejected');
    expect(lapsed.querySelector('button[type="submit"]')!.textContent).toBe('Reject the flag');
  });
});

describe('stored advisories in the reader\'s language', () => {
  it('when a French community worker opens Advisories, then a composed advisory reads in French and a hand-written one as written', async () => {
    const worker = {
      id: uuid(103), email: 'worker@halvern.example', displayName: 'Wen Worker', role: 'worker', districts: [{ id: district.id, code: district.code, name: district.name }],
      preferences: { language: 'fr', temperatureUnit: 'C', rainUnit: 'mm' },
    };
    const advisory = (id: number, message: string, composed: unknown) => ({
      id: uuid(id), flagId: uuid(id + 1), districtId: district.id, districtCode: district.code, districtName: district.name, tier: 'baseline',
      message, composed, actions: [], caution: 'c', issuedBy: null, issuedAt: '2026-12-01T09:00:00.000Z', expiresAt: '2026-12-29T09:00:00.000Z', current: true, recipients: 3,
    });
    fakeApi({
      'GET /api/me': () => json(200, worker),
      'GET /api/advisories': () => json(200, {
        advisories: [
          advisory(600, 'English stored text', { code: 'diapause', params: { ...params, reason: 'manual', tier: 'baseline', shares: [] } }),
          advisory(610, 'Videz l’eau stagnante cette semaine.', null),
        ],
      }),
    });
    view = await renderRoutes('/advisories');
    const messages = await waitFor(() => {
      const found = [...view!.container.querySelectorAll('[data-testid="advisory-message"]')].map((p) => p.textContent ?? '');
      if (found.length < 2) throw new Error('not yet');
      return found;
    }, 3000);
    expect(messages[0]).toContain('repos hivernal (diapause)');
    expect(messages[0]).toContain('autorité sanitaire nationale');
    expect(messages[0]).not.toContain('English stored text');
    expect(messages[0]).not.toMatch(/favorisent les moustiques/);
    expect(messages[1]).toBe('Videz l’eau stagnante cette semaine.');
  });
});
