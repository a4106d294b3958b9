import { act } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { i18n, setLanguage } from '../../src/i18n';
import { fakeApi, json } from './support/fake-api';
import { renderRoutes, waitFor, type Rendered } from './support/render';

/** Issue 21 (admin): the invite landing page opens in the invite's language, named on the mailed link. */
let view: Rendered | undefined;
afterEach(async () => {
  view?.unmount();
  view = undefined;
  await act(() => setLanguage('en'));
});

describe('invite landing page', () => {
  it('when the invite link says lang=fr, then the page is in French although the device was in English', async () => {
    fakeApi({ 'GET /api/me': () => json(401, { error: { code: 'unauthenticated', message: 'Sign in first.' } }) });
    expect(i18n.language).toBe('en');
    view = await renderRoutes('/invite/accept?token=abc&lang=fr');
    await waitFor(() => expect(view!.container.querySelector('h1')?.textContent).toBe('Bienvenue dans Broodcast'));
    expect(i18n.language).toBe('fr');
    expect(document.documentElement.lang).toBe('fr');
  });

  it('when the link names no language or an unknown one, then the page keeps the language of the device', async () => {
    fakeApi({ 'GET /api/me': () => json(401, { error: { code: 'unauthenticated', message: 'Sign in first.' } }) });
    view = await renderRoutes('/invite/accept?token=abc&lang=xx');
    await waitFor(() => expect(view!.container.querySelector('h1')?.textContent).toBe('Welcome to Broodcast'));
    expect(i18n.language).toBe('en');
  });
});
