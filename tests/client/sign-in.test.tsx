import { afterEach, describe, expect, it, vi } from 'vitest';
import { QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { createQueryClient } from '../../src/app/query-client';
import { SignInPage } from '../../src/features/auth/sign-in.page';
import { click, getButton, getByLabel, render, typeInto, waitFor, type Rendered } from './support/render';

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

let view: Rendered | undefined;
afterEach(() => {
  view?.unmount();
  view = undefined;
  vi.unstubAllGlobals();
});

async function renderSignIn(entry = '/sign-in') {
  const router = createMemoryRouter(
    [
      { path: '/sign-in', element: <SignInPage /> },
      { path: '/', element: <p>Ladder screen</p> },
      { path: '/admin/users', element: <p>Users screen</p> },
    ],
    { initialEntries: [entry] },
  );
  view = await render(
    <QueryClientProvider client={createQueryClient()}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return view.container;
}

async function submit(container: HTMLElement, email: string, password: string) {
  await typeInto(getByLabel(container, 'E-mail'), email);
  await typeInto(getByLabel(container, 'Password'), password);
  await click(getButton(container, 'Sign in'));
}

describe('sign-in form', () => {
  it('when the server answers 401, then the form says only that the e-mail or password is not right', async () => {
    const fetchMock = vi.fn(async () => json(401, { error: { code: 'invalid_credentials', message: 'No such user.' } }));
    vi.stubGlobal('fetch', fetchMock);
    const container = await renderSignIn();

    await submit(container, 'officer@halvern.example', 'wrong-password');

    const alert = await waitFor(() => {
      const el = container.querySelector('[role="alert"]');
      if (!el) throw new Error('no alert yet');
      return el;
    });
    expect(alert.textContent).toBe('The e-mail or password is not right.');
    expect(container.textContent).not.toContain('No such user');
    expect(fetchMock).toHaveBeenCalledWith('/api/auth/sign-in', expect.objectContaining({ method: 'POST' }));
    expect(getByLabel(container, 'Password').value).toBe('');
  });

  it('when the server answers 429, then the form asks the person to wait', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => json(429, { error: { code: 'rate_limited', message: 'Slow down.' } })));
    const container = await renderSignIn();

    await submit(container, 'officer@halvern.example', 'whatever');

    await waitFor(() => expect(container.querySelector('[role="alert"]')?.textContent).toMatch(/Too many sign-in attempts/));
  });

  it('when the e-mail is not an address, then the field says so and nothing is sent', async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal('fetch', fetchMock);
    const container = await renderSignIn();

    await submit(container, 'not-an-address', 'x');

    await waitFor(() => expect(container.textContent).toContain('E-mail is not an e-mail address.'));
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('when the credentials are right, then the person lands where they were going', async () => {
    const me = { id: '00000000-0000-4000-8000-000000000001', email: 'admin@halvern.example', displayName: 'Ada', role: 'admin', districts: [] };
    vi.stubGlobal('fetch', vi.fn(async () => json(200, me)));
    const container = await renderSignIn('/sign-in?next=%2Fadmin%2Fusers');

    await submit(container, 'Admin@Halvern.example', 'broodcast-demo');

    await waitFor(() => expect(container.textContent).toBe('Users screen'));
  });
});
