import { describe, expect, it } from 'vitest';
import { DEFAULT_TIER_SETTINGS } from '../../shared/tier/tier-settings';
import en from '../../src/i18n/locales/en/tier-settings.json';
import subsEn from '../../src/i18n/locales/en/subscriptions.json';
import { adminMe, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, renderRoutes, typeInto, waitFor } from './support/render';

const D = '00000000-0000-4000-8000-000000000001';

describe('the tier settings screen (issue 16, item 9)', () => {
  it('when an admin previews new cut points, then the districts that would change show from → to; saving sends the reason', async () => {
    let saved: unknown = null;
    fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/tier-settings': () => json(200, { settings: DEFAULT_TIER_SETTINGS, version: null, history: [] }),
      'POST /api/tier-settings/preview': () => json(200, { epiYear: 2026, epiWeek: 33, districts: 12, changes: [{ districtId: D, code: 'SAL', name: 'Saltmere', from: 'raised', to: 'high', scoreFrom: 0.31, scoreTo: 0.52 }] }),
      'PUT /api/tier-settings': (init) => { saved = JSON.parse(String(init.body)); return json(200, { version: 7, settings: DEFAULT_TIER_SETTINGS }); },
    });
    const { container: c } = await renderRoutes('/admin/tier-settings');
    await waitFor(() => expect(c.querySelector('h1')?.textContent).toBe(en.title), 5000);
    await typeInto(await waitFor(() => getByLabel(c, en.tier.high), 3000), '0.3');
    await click(getButton(c, en.preview));
    await waitFor(() => expect(c.textContent).toContain('Saltmere (SAL)'));
    expect(c.textContent).toContain(en.previewWeek_one.replace('{{week}}', '33').replace('{{year}}', '2026').replace('{{count}}', '1').replace('{{total}}', '12'));
    expect(getButton(c, en.save).disabled).toBe(true); // no reason yet
    await typeInto(getByLabel(c, en.reason), 'Fewer false alarms last season');
    await click(getButton(c, en.save));
    await waitFor(() => expect(c.textContent).toContain(en.saved.replace('{{version}}', '7')));
    expect(saved).toMatchObject({ reason: 'Fewer false alarms last season', settings: { cuts: { high: 0.3 } } });
  });
});

describe('the unsubscribe page (issue 16, item 8)', () => {
  it('when the link is opened, then it only asks; the button stops the mail and undo puts it back', async () => {
    const calls: string[] = [];
    const state = (subscribed: boolean) => json(200, { email: 'ana@halvern.example', districtName: null, scope: 'bulletin', language: 'en', subscribed });
    fakeApi({
      'GET /api/me': () => json(401, { error: { code: 'unauthenticated', message: 'Sign in.' } }),
      'GET /api/unsubscribe/tok.en.value': () => { calls.push('GET'); return state(true); },
      'POST /api/unsubscribe/tok.en.value': () => { calls.push('POST'); return state(false); },
      'POST /api/unsubscribe/tok.en.value/undo': () => { calls.push('UNDO'); return state(true); },
    });
    const { container: c } = await renderRoutes('/unsubscribe?token=tok.en.value');
    await waitFor(() => expect(c.textContent).toContain(subsEn.unsubscribe.askBulletin.replace('{{email}}', 'ana@halvern.example')), 5000);
    expect(calls).toEqual(['GET']); // opening changed nothing
    await click(getButton(c, subsEn.unsubscribe.confirm));
    await waitFor(() => expect(c.textContent).toContain(subsEn.unsubscribe.doneBulletin.replace('{{email}}', 'ana@halvern.example')));
    await click(getButton(c, subsEn.unsubscribe.undo));
    await waitFor(() => expect(c.textContent).toContain(subsEn.unsubscribe.undone.replace('{{email}}', 'ana@halvern.example')));
    expect(calls).toEqual(['GET', 'POST', 'UNDO']);
  });
});
