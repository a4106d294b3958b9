import { act } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { i18n, setLanguage, type Language } from '../../src/i18n';
import { seasonRun } from './support/board-fixtures';
import { adminMe, fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, selectOption, typeInto, waitFor, type Rendered, renderRoutes } from './support/render';

let view: Rendered | undefined;
afterEach(async () => {
  await act(() => setLanguage('en'));
  localStorage.removeItem('broodcast.language');
});

async function open(path: string) {
  const opened = await renderRoutes(path);
  view = opened;
  const router = opened.router;
  return view.container;
}

const NNBSP = '\u202f'; // narrow no-break space: French thousands
const NBSP = '\u00a0'; // no-break space: before a French colon or %, Portuguese thousands

/** What each language must show; written out by hand, not computed with Intl, so a wrong locale fails. */
const CASES: {
  lng: Exclude<Language, 'en'>;
  signIn: string;
  email: string;
  password: string;
  submit: string;
  invalidEmail: string;
  nav: string[];
  mainNav: string;
  role: string;
  signOut: string;
  seasonRuns: string;
  rows: string;
  asOf: string;
  progress: string;
}[] = [
  {
    lng: 'fr',
    signIn: 'Connexion',
    email: 'Adresse e-mail',
    password: 'Mot de passe',
    submit: 'Se connecter',
    invalidEmail: `Adresse e-mail${NNBSP}: ce n’est pas une adresse e-mail valide.`,
    nav: ['Classement', 'Utilisateurs', 'Districts', 'Calculs de saison'],
    mainNav: 'Menu principal',
    role: 'Administrateur',
    signOut: 'Se déconnecter',
    seasonRuns: 'Calculs de saison',
    rows: `1${NNBSP}234${NNBSP}567`,
    asOf: '1 juin 2025',
    progress: `3 sur 12 districts (25${NBSP}%)`,
  },
  {
    lng: 'es',
    signIn: 'Iniciar sesión',
    email: 'Correo electrónico',
    password: 'Contraseña',
    submit: 'Iniciar sesión',
    invalidEmail: 'Correo electrónico: no es una dirección de correo electrónico válida.',
    nav: ['Escalafón', 'Usuarios', 'Distritos', 'Cálculos de temporada'],
    mainNav: 'Menú principal',
    role: 'Administrador',
    signOut: 'Cerrar sesión',
    seasonRuns: 'Cálculos de temporada',
    rows: '1.234.567',
    asOf: '1 jun 2025',
    progress: `3 de 12 distritos (25${NBSP}%)`,
  },
  {
    lng: 'pt',
    signIn: 'Iniciar sessão',
    email: 'Endereço de e-mail',
    password: 'Palavra-passe',
    submit: 'Iniciar sessão',
    invalidEmail: 'Endereço de e-mail: não é um endereço de e-mail válido.',
    nav: ['Escala', 'Utilizadores', 'Distritos', 'Cálculos da época'],
    mainNav: 'Menu principal',
    role: 'Administrador',
    signOut: 'Terminar sessão',
    seasonRuns: 'Cálculos da época',
    rows: `1${NBSP}234${NBSP}567`,
    asOf: '1/06/2025',
    progress: '3 de 12 distritos (25%)',
  },
];

describe('the app shell in French, Spanish and Portuguese', () => {
  for (const c of CASES) {
    it(`when the language is ${c.lng}, then the sign-in page shows its words, its language picker and translated field messages`, async () => {
      await act(() => setLanguage(c.lng));
      const fetchMock = fakeApi({ 'GET /api/me': () => json(401, { error: { code: 'unauthorized', message: 'Sign in to continue.' } }) });
      const container = await open('/sign-in');
      await waitFor(() => expect(container.querySelector('h1')?.textContent).toBe(c.signIn));
      expect(document.title).toBe(`${c.signIn} · Broodcast`);
      expect(document.documentElement.lang).toBe(c.lng);
      expect(getByLabel<HTMLSelectElement>(container, i18n.t('common:language')).value).toBe(c.lng);

      await typeInto(getByLabel(container, c.email), 'not-an-address');
      await typeInto(getByLabel(container, c.password), 'x');
      await click(getButton(container, c.submit));
      await waitFor(() => expect(container.textContent).toContain(c.invalidEmail));
      expect(fetchMock.mock.calls.some(([, init]) => (init as RequestInit | undefined)?.method === 'POST')).toBe(false);
    });

    it(`when the language is ${c.lng}, then the signed-in menu, the role and the season runs show translated words, numbers and dates`, async () => {
      await act(() => setLanguage(c.lng));
      const running = seasonRun({ rowsWritten: 1_234_567 });
      fakeApi({
        // The account's own language is what the signed-in layout applies.
        'GET /api/me': () => json(200, { ...adminMe, preferences: { ...adminMe.preferences, language: c.lng } }),
        'GET /api/season-runs': () => json(200, { runs: [running] }),
        [`GET /api/season-runs/${running.id}`]: () => json(200, running),
      });
      const container = await open('/season-runs');
      await waitFor(() => expect(container.querySelector('h1')?.textContent).toBe(c.seasonRuns), 5000);

      const nav = container.querySelector('header nav')!;
      expect(nav.getAttribute('aria-label')).toBe(c.mainNav);
      const labels = [...nav.querySelectorAll('a')].map((a) => a.textContent);
      expect(labels.slice(0, 3)).toEqual(c.nav.slice(0, 3));
      expect(labels).toContain(c.nav[3]);
      expect(container.querySelector('[data-testid="current-role"]')?.textContent).toBe(c.role);
      expect(getButton(container, c.signOut)).toBeTruthy();

      await waitFor(() => expect(container.textContent).toContain(c.rows));
      expect(container.textContent).toContain(c.asOf);
      await waitFor(() => expect(container.textContent).toContain(c.progress));
    });
  }

  it('when someone picks Français on the sign-in page, then the page turns French and the choice is remembered on the device', async () => {
    fakeApi({});
    const container = await open('/sign-in');
    await waitFor(() => expect(container.querySelector('h1')?.textContent).toBe('Sign in'));
    await selectOption(getByLabel<HTMLSelectElement>(container, 'Language'), 'fr');
    await waitFor(() => expect(container.querySelector('h1')?.textContent).toBe('Connexion'));
    expect(getByLabel(container, 'Mot de passe')).toBeTruthy();
    expect(getButton(container, 'Se connecter')).toBeTruthy();
    expect(localStorage.getItem('broodcast.language')).toBe('fr');
    expect(document.documentElement.lang).toBe('fr');
  });
});
