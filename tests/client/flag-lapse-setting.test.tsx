import { describe, expect, it } from 'vitest';
import { DEFAULT_TIER_SETTINGS } from '../../shared/tier/tier-settings';
import en from '../../src/i18n/locales/en/tier-settings.json';
import { adminMe, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, renderRoutes, typeInto, waitFor } from './support/render';

const ADA = { id: '00000000-0000-4000-8000-000000000009', displayName: 'Ada Admin' };

describe('the flag lapse setting on the tier settings screen', () => {
  it('when an admin sets open flags to lapse after 3 weeks with a reason, then the setting is sent, saved and shown', async () => {
    let stored = { lapseWeeks: 2, updatedAt: null as string | null, updatedBy: null as typeof ADA | null };
    const sent: unknown[] = [];
    fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/tier-settings': () => json(200, { settings: DEFAULT_TIER_SETTINGS, version: null, history: [] }),
      'GET /api/flag-settings': () => json(200, stored),
      'PUT /api/flag-settings': (init) => {
        const body = JSON.parse(String(init.body));
        sent.push(body);
        stored = { lapseWeeks: body.lapseWeeks, updatedAt: '2026-11-30T09:00:00.000Z', updatedBy: ADA };
        return json(200, stored);
      },
    });
    const { container: c } = await renderRoutes('/admin/tier-settings');
    await waitFor(() => expect(c.textContent).toContain(en.flagLapse.title), 5000);
    await waitFor(() => expect(c.querySelector('[data-lapse-weeks]')?.textContent).toContain('Now: 2 weeks.'), 3000);
    expect(c.textContent).toContain(en.flagLapse.neverChanged);

    const weeks = getByLabel(c, en.flagLapse.weeks);
    expect(weeks.value).toBe('2');
    await typeInto(weeks, '3');
    // No reason yet: nothing can be saved.
    expect(getButton(c, en.flagLapse.save).disabled).toBe(true);
    await typeInto(getByLabel(c, en.flagLapse.reason), 'Supervisors sign off fortnightly in the rainy season');
    await click(getButton(c, en.flagLapse.save));
    await waitFor(() => expect(c.textContent).toContain('Saved: open flags now lapse after 3 weeks.'));
    expect(sent).toEqual([{ lapseWeeks: 3, reason: 'Supervisors sign off fortnightly in the rainy season' }]);
    expect(c.querySelector('[data-lapse-weeks]')?.textContent).toContain('Now: 3 weeks.');
    expect(c.querySelector('[data-lapse-weeks]')?.textContent).toContain('Last changed by Ada Admin');
  });

  it('when the weeks are out of 1–26, then Save stays disabled and nothing is sent', async () => {
    const sent: unknown[] = [];
    fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/tier-settings': () => json(200, { settings: DEFAULT_TIER_SETTINGS, version: null, history: [] }),
      'GET /api/flag-settings': () => json(200, { lapseWeeks: 2, updatedAt: null, updatedBy: null }),
      'PUT /api/flag-settings': (init) => {
        sent.push(init.body);
        return json(200, { lapseWeeks: 2, updatedAt: null, updatedBy: null });
      },
    });
    const { container: c } = await renderRoutes('/admin/tier-settings');
    const weeks = await waitFor(() => getByLabel(c, en.flagLapse.weeks), 5000);
    await typeInto(getByLabel(c, en.flagLapse.reason), 'A long wait');
    for (const bad of ['0', '27', '2.5']) {
      await typeInto(weeks, bad);
      expect(getButton(c, en.flagLapse.save).disabled).toBe(true);
    }
    expect(sent).toEqual([]);
  });
});
