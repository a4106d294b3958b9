import { afterEach, describe, expect, it } from 'vitest';
import { i18n } from '../../src/i18n';
import { adminMe, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, selectOption, waitFor, type Rendered, renderRoutes } from './support/render';

let view: Rendered | undefined;
afterEach(async () => {
  await i18n.changeLanguage('en'); // the next test reads the English interface again
});

/** A server holding one user's preferences: PATCH changes them, GET /api/me answers them. */
function preferencesServer() {
  let preferences = { language: 'en', temperatureUnit: 'C', rainUnit: 'mm' };
  const fetchMock = fakeApi({
    'GET /api/me': () => json(200, { ...adminMe, preferences }),
    'PATCH /api/me/preferences': (init) => {
      preferences = { ...preferences, ...JSON.parse(init.body as string) };
      return json(200, preferences);
    },
  });
  const patches = () =>
    fetchMock.mock.calls.filter((c) => (c[1] as RequestInit | undefined)?.method === 'PATCH').map((c) => JSON.parse((c[1] as RequestInit).body as string));
  return { patches };
}

async function openSettings() {
  view = await renderRoutes('/settings');
  return waitFor(() => {
    const form = view!.container.querySelector<HTMLFormElement>('form');
    if (!form) throw new Error('no settings form yet');
    return form;
  });
}

describe('settings', () => {
  it('when French is chosen and saved, then the whole interface switches to French', async () => {
    const server = preferencesServer();
    const form = await openSettings();
    expect(view!.container.querySelector('h1')!.textContent).toBe('Settings');
    await selectOption(getByLabel<HTMLSelectElement>(form, 'Language'), 'fr');
    await click(getButton(form, 'Save my settings'));

    await waitFor(() => expect(view!.container.querySelector('h1')!.textContent).toBe('Paramètres'));
    expect(server.patches()).toEqual([{ language: 'fr' }]);
    expect(i18n.language).toBe('fr');
    expect(document.documentElement.lang).toBe('fr');
    expect(getByLabel<HTMLSelectElement>(view!.container, 'Unité de température').value).toBe('C');
    expect(view!.container.textContent).toContain('Enregistré.');
    // The signed-in frame too, not only this page.
    expect(view!.container.querySelector('nav')!.textContent).not.toContain('Settings');
  });

  it('when °F and inches are chosen and saved, then the units every screen reads give °F and inches', async () => {
    const server = preferencesServer();
    const form = await openSettings();
    const sample = () => view!.container.querySelector('[data-testid="units-sample"]')!.textContent;
    expect(sample()).toContain('30 °C');
    await selectOption(getByLabel<HTMLSelectElement>(form, 'Temperature unit'), 'F');
    await selectOption(getByLabel<HTMLSelectElement>(form, 'Rain unit'), 'in');
    await click(getButton(form, 'Save my settings'));

    await waitFor(() => expect(sample()).toContain('86 °F'));
    expect(sample()).toContain('0.5 in');
    expect(server.patches()).toEqual([{ temperatureUnit: 'F', rainUnit: 'in' }]);
    expect(i18n.language).toBe('en');
  });
});
