import { act } from 'react';
import { describe, expect, it } from 'vitest';
import { adminMe, demoDistricts, demoUsers, fakeApi, json, officerMe } from './support/fake-api';
import { demoBoard } from './support/board-fixtures';
import { waitFor, type Rendered, renderRoutes } from './support/render';

let view: Rendered | undefined;
async function open(path: string) {
  const opened = await renderRoutes(path);
  view = opened;
  const router = opened.router;
  return { container: view.container, router };
}

const heading = (c: HTMLElement) => c.querySelector('h1')?.textContent;

describe('app shell', () => {
  it('when there is no session, then the app goes to the sign-in page and remembers where it was going', async () => {
    fakeApi({ 'GET /api/me': () => json(401, { error: { code: 'unauthorized', message: 'Sign in to continue.' } }) });
    const { container, router } = await open('/admin/users');
    await waitFor(() => expect(heading(container)).toBe('Sign in'));
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?next=%2Fadmin%2Fusers');
  });

  it('when an admin opens the Ladder, then the header, the nav, the ranked districts, the demo label and the cautions show', async () => {
    fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/board': () => json(200, demoBoard),
      'GET /api/districts/boundaries': () => json(200, { type: 'FeatureCollection', features: [] }),
    });
    const { container } = await open('/');
    await waitFor(() => expect(container.textContent).toContain('Saltmarsh Coast'));
    expect(heading(container)).toBe('Ladder');
    expect(container.querySelector('[data-testid="current-role"]')?.textContent).toBe('Admin');
    const nav = container.querySelector('nav[aria-label="Main"]')!;
    const labels = [...nav.querySelectorAll('a')].map((a) => a.textContent);
    expect(labels.slice(0, 3)).toEqual(['Ladder', 'Users', 'Districts']);
    expect(labels).toContain('Season runs');
    expect(container.textContent).toContain('Demo data — the Halvern Region is invented');
    expect(container.textContent).toContain('Above the channel');
    expect(container.textContent).toContain('licensed clinician');
  });

  it('when an officer opens the Users screen, then it says Not allowed and the nav has no admin items', async () => {
    fakeApi({ 'GET /api/me': () => json(200, officerMe) });
    const { container } = await open('/admin/users');
    await waitFor(() => expect(heading(container)).toBe('Not allowed'));
    expect(container.querySelector('[data-testid="current-role"]')?.textContent).toBe('Health officer');
    const nav = container.querySelector('nav[aria-label="Main"]')!;
    const labels = [...nav.querySelectorAll('a')].map((a) => a.textContent);
    expect(labels[0]).toBe('Ladder');
    expect(labels).not.toContain('Users');
    expect(labels).not.toContain('Districts');
  });

  it('when an admin opens Users and Districts, then both tables list their rows', async () => {
    fakeApi({
      'GET /api/me': () => json(200, adminMe),
      'GET /api/users': () => json(200, { users: demoUsers }),
      'GET /api/districts': () => json(200, { districts: demoDistricts }),
    });
    const users = await open('/admin/users');
    await waitFor(() => expect(users.container.textContent).toContain('worker@halvern.example'));
    expect(users.container.textContent).toContain('invite pending');
    expect(users.container.textContent).toContain('Community worker');
    await waitFor(() => expect(users.container.textContent).toContain('HV-01 — Saltmarsh Coast'));

    await act(() => users.router.navigate('/admin/districts'));
    await waitFor(() => expect(heading(users.container)).toBe('Districts'));
    await waitFor(() => expect(users.container.textContent).toContain('Orrin Valley'));
    expect(users.container.textContent).toContain('Not recorded');
  });

  it('when the path matches no screen, then the not-found page shows inside the layout', async () => {
    fakeApi({ 'GET /api/me': () => json(200, officerMe) });
    const { container } = await open('/no/such/page');
    await waitFor(() => expect(heading(container)).toBe('Page not found'));
    expect(container.querySelector('nav[aria-label="Main"]')).not.toBeNull();
  });
});
