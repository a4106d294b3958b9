import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { expect, onTestFailed } from 'vitest';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import type { LiveServer } from './demo-browser';

/*
 * The weekly walks (tests/browser/walk-*.test.ts): one role's ordinary week, done through the screens in
 * Chromium. A guard on the page collects every answer of 500 or more, every console error and every
 * uncaught page error, and each walk ends by asserting the guard saw none. Screenshots of the key steps go
 * to the git-ignored .local/walks/<role>/, to be looked at by a person.
 */

const SHOT_ROOT = fileURLToPath(new URL('../../.local/walks/', import.meta.url));

/**
 * A walk is a whole week of steps in one test, each step waiting on what the screen shows; the browser
 * project's 60 s per test is meant for one screen. On an idle machine a walk takes 10–25 s; the two cores
 * shared with other test runs can make it several times slower, so the walk gets room for that, and
 * each step still fails on its own 30 s wait.
 */
export const WALK_TIMEOUT = 150_000;

export const PHONE = { viewport: { width: 360, height: 740 }, deviceScaleFactor: 1, isMobile: true, hasTouch: true } as const;
export const DESKTOP = { viewport: { width: 1280, height: 800 }, deviceScaleFactor: 1, isMobile: false, hasTouch: false } as const;

export type Guard = {
  /** 5xx answers, console errors and page errors seen so far, one readable line each. */
  problems: string[];
  /** 4xx answers seen (for the record: some are expected, e.g. a refused form). */
  clientErrors: string[];
  /** Runs `fn` with the connection cut; network errors logged meanwhile are expected and not counted. */
  offline: <T>(fn: () => Promise<T>) => Promise<T>;
  /** Fails the test listing every problem seen. */
  assertClean: () => void;
};

/**
 * Watches a page: any response with status ≥ 500, any console message of type error and any uncaught
 * exception. Chromium also logs "Failed to load resource … status of 4xx" as a console error for every
 * refused request; those are answers the app handles (a 401 before sign-in, a refused form) and are
 * kept apart in `clientErrors` instead. While `offline` runs, the browser's own "disconnected" errors
 * are expected.
 */
export function guardPage(page: Page, context: BrowserContext): Guard {
  const problems: string[] = [];
  const clientErrors: string[] = [];
  let cutOff = false;
  const offlineNoise = /ERR_INTERNET_DISCONNECTED|Failed to fetch|net::ERR_|NetworkError/;
  page.on('response', (r) => {
    const status = r.status();
    const where = `${r.request().method()} ${new URL(r.url()).pathname}`;
    if (status >= 500) problems.push(`${status} answer: ${where}`);
    else if (status >= 400) clientErrors.push(`${status} ${where}`);
  });
  page.on('console', (m) => {
    const text = m.text();
    // A warning that a form wrote a value the input cannot hold ("The specified value 'NaN' cannot be parsed").
    if (m.type() === 'warning' && /cannot be parsed/.test(text)) problems.push(`console warning on ${new URL(page.url()).pathname}: ${text}`);
    if (m.type() !== 'error') return;
    if (/Failed to load resource: the server responded with a status of 4\d\d/.test(text)) return;
    if (/Failed to load resource: the server responded with a status of 5\d\d/.test(text)) return; // counted by status
    if (cutOff && offlineNoise.test(text)) return;
    problems.push(`console error on ${new URL(page.url()).pathname}: ${text}`);
  });
  page.on('pageerror', (e) => problems.push(`page error on ${new URL(page.url()).pathname}: ${e.message}`));
  return {
    problems,
    clientErrors,
    offline: async (fn) => {
      cutOff = true;
      await context.setOffline(true);
      try {
        return await fn();
      } finally {
        await context.setOffline(false);
        // The "disconnected" errors of requests begun offline may be logged just after; they end when the
        // app's first request online is answered, which the caller waits for.
      }
    },
    assertClean: () => {
      if (clientErrors.length) console.info(`4xx answers seen (handled by the app):\n  ${clientErrors.join('\n  ')}`);
      expect(problems, 'no 5xx answer, console error or page error during the walk').toEqual([]);
    },
  };
}

export type Walker = {
  page: Page;
  context: BrowserContext;
  guard: Guard;
  /** A screenshot of the viewport into .local/walks/<role>/NN-<name>.png. */
  shot: (name: string) => Promise<void>;
  /** Clicks the main-menu item with this name and waits for the page heading. */
  go: (menuItem: string, heading?: string | RegExp) => Promise<void>;
  close: () => Promise<void>;
};

/** A fresh browser context in English with the guard on, signed in through the form as `email`. */
export async function walkAs(
  browser: Browser,
  server: LiveServer,
  role: string,
  email: string,
  size: typeof PHONE | typeof DESKTOP = DESKTOP,
): Promise<Walker> {
  const context = await browser.newContext({ ...size, locale: 'en-GB', reducedMotion: 'reduce' });
  await context.addInitScript(() => {
    try {
      window.localStorage.setItem('broodcast.language', 'en');
    } catch {
      // no storage: the context's locale applies
    }
  });
  const page = await context.newPage();
  const guard = guardPage(page, context);
  const dir = path.join(SHOT_ROOT, role);
  mkdirSync(dir, { recursive: true });
  let n = 0;
  // A failed step leaves a picture of the screen it stopped on, and the guard's findings so far.
  onTestFailed(async () => {
    await page.screenshot({ path: path.join(dir, 'failed.png'), fullPage: true }).catch(() => undefined);
    if (guard.problems.length) console.info(`guard findings before the failure:\n  ${guard.problems.join('\n  ')}`);
  });
  const menu = () => page.locator('nav[aria-label="Main"]');

  await page.goto(server.baseUrl + '/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('current-role').waitFor();

  return {
    page,
    context,
    guard,
    shot: async (name) => {
      n += 1;
      await page.screenshot({ path: path.join(dir, `${String(n).padStart(2, '0')}-${name}.png`) });
    },
    go: async (menuItem, heading) => {
      // On a phone the menu scrolls sideways; the click scrolls the item into view.
      await menu().getByRole('link', { name: menuItem, exact: true }).click();
      await page.getByRole('heading', { level: 1, name: heading ?? menuItem }).waitFor();
    },
    close: () => context.close(),
  };
}
