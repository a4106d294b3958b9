import { existsSync, readFileSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoIfEmpty } from '../../sample/seed-demo';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { runSeasonNow } from '../../server/season/season-run.service';
import { launchBrowser } from '../support/browser';
import { signedInAgent } from '../support/factories';
import { startLiveServer } from '../support/live-server';

/**
 * The community worker's phone: 360 × 740 CSS px, touch. The installable app (docs/offline.md) opens
 * again without a connection from its service worker, a survey filled offline waits in the outbox and
 * reaches the server exactly once, and the worker's screens fit the phone (no horizontal scroll, touch
 * targets of at least 24 × 24 px — WCAG 2.2, success criterion 2.5.8 "Target Size (Minimum)").
 */
let server: Awaited<ReturnType<typeof startLiveServer>>;
let browser: Browser;
let context: BrowserContext;
let page: Page;

const count = async (locality: string) =>
  Number((await server.ds.query(`SELECT count(*)::int AS n FROM larval_surveys WHERE locality = $1`, [locality]))[0].n);

/** Widest content of the page, in CSS px (more than the viewport means a horizontal scroll). */
const scrollWidth = () => page.evaluate(() => Math.max(document.documentElement.scrollWidth, document.body.scrollWidth));

/**
 * Controls in <main> smaller than 24 × 24 px. A checkbox or radio counts with its label (the label is
 * part of its target); links inside running text are exempt under the criterion, so only buttons,
 * fields and stand-alone links are measured.
 */
const smallTargets = () =>
  page.evaluate(() => {
    const small: string[] = [];
    const visible = (r: DOMRect) => r.width > 0 && r.height > 0;
    for (const el of document.querySelectorAll<HTMLElement>('main button, main select, main input, main textarea, main a, main summary')) {
      let target: HTMLElement = el;
      if (el instanceof HTMLInputElement && (el.type === 'checkbox' || el.type === 'radio')) target = el.closest('label') ?? el;
      if (el instanceof HTMLInputElement && el.type === 'hidden') continue;
      if (el.tagName === 'A') {
        const parent = el.parentElement;
        const inText = parent && ['P', 'LI', 'TD', 'DD', 'SPAN'].includes(parent.tagName) && (parent.textContent ?? '').trim() !== (el.textContent ?? '').trim();
        if (inText) continue;
      }
      const r = target.getBoundingClientRect();
      if (!visible(r)) continue;
      if (r.width < 24 || r.height < 24) small.push(`${el.tagName.toLowerCase()} "${(el.textContent || el.getAttribute('aria-label') || el.getAttribute('name') || '').trim().slice(0, 40)}" ${Math.round(r.width)}×${Math.round(r.height)}`);
    }
    return small;
  });

beforeAll(async () => {
  server = await startLiveServer();
  await seedDemoIfEmpty(server.ds, { nodeEnv: 'test', bcryptCost: 4 });
  // An advisory for the worker's district, so the advisories page is measured with content on it.
  await runSeasonNow(server.ctx);
  const supervisor = await signedInAgent(server.app, 'supervisor@halvern.example', DEMO_PASSWORD);
  const flag = (await supervisor.get('/api/flags')).body.flags.find((f: { districtName: string }) => f.districtName === 'Saltmere');
  if (flag) expect((await supervisor.post(`/api/flags/${flag.id}/approve`).send({ version: flag.version })).status).toBe(200);
  browser = await launchBrowser();
  context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, serviceWorkers: 'allow' });
  page = await context.newPage();
});
afterAll(async () => {
  await context?.close();
  await browser?.close();
  await server?.stop();
});

describe('the community worker on a phone', () => {
  it('when the client is built, then the service worker, its manifest and icons are in dist/client and the shell is precached, never /api', () => {
    expect(existsSync('dist/client/sw.js')).toBe(true);
    expect(existsSync('dist/client/manifest.webmanifest')).toBe(true);
    const manifest = JSON.parse(readFileSync('dist/client/manifest.webmanifest', 'utf8'));
    expect(manifest).toMatchObject({ name: 'Broodcast', start_url: '/', display: 'standalone' });
    for (const icon of manifest.icons as { src: string }[]) expect(existsSync(`dist/client${icon.src}`), icon.src).toBe(true);
    const sw = readFileSync('dist/client/sw.js', 'utf8');
    expect(sw).toContain('index.html');
    expect(sw).toMatch(/lato-latin-400-normal-[\w-]+\.woff2/);
    expect(sw).toContain('NetworkOnly');
    expect(sw).not.toMatch(/url:"\/?api\//);
    expect(readFileSync('dist/client/index.html', 'utf8')).toContain('rel="manifest"');
  });

  it('when the worker signs in, then the service worker takes control of the page after a reload', async () => {
    await page.goto(server.baseUrl + '/sign-in');
    await page.getByLabel('E-mail').fill('worker@halvern.example');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('current-role').waitFor();
    const active = await page.evaluate(async () => {
      const worker = (await navigator.serviceWorker.ready).active!;
      if (worker.state !== 'activated') await new Promise((r) => worker.addEventListener('statechange', () => worker.state === 'activated' && r(null)));
      return worker.state;
    });
    expect(active).toBe('activated');
    await page.reload();
    await page.getByTestId('current-role').waitFor();
    expect(await page.evaluate(() => navigator.serviceWorker.controller?.scriptURL)).toBe(server.baseUrl + '/sw.js');
  });

  it('when the worker opens their district view and the advisories at 360 px, then nothing scrolls sideways and every target is at least 24 px', async () => {
    await page.goto(server.baseUrl + '/');
    await page.locator('main h1').waitFor();
    await page.locator('main').getByText('Saltmere').first().waitFor();
    expect(await scrollWidth()).toBeLessThanOrEqual(360);
    // Issue 21: the first screen leads with the worker's own district and its advisories, inside the first
    // 740 px; the cautions are one tap away (closed); the Ladder's columns fit the phone without a sideways scroll.
    const home = page.getByTestId('worker-home');
    const yourDistrict = home.getByRole('heading', { level: 2, name: /^Your district: Saltmere/ });
    await yourDistrict.waitFor();
    const advisoriesHeading = page.locator('#home-advisories');
    for (const el of [yourDistrict, advisoriesHeading]) {
      const box = (await el.boundingBox())!;
      expect(box.y + box.height).toBeLessThanOrEqual(740);
    }
    expect(await home.locator('details').evaluate((d) => (d as HTMLDetailsElement).open)).toBe(false);
    const ladder = page.locator('.ladder-scroll');
    expect(await ladder.evaluate((el) => el.scrollWidth - el.clientWidth)).toBeLessThanOrEqual(1);

    await page.locator('nav[aria-label="Main"]').getByRole('link', { name: 'Advisories' }).click();
    await page.getByRole('heading', { level: 1, name: 'Advisories' }).waitFor();
    await page.getByTestId('advisories').or(page.getByText('No advisory has been sent yet.')).waitFor();
    expect(await scrollWidth()).toBeLessThanOrEqual(360);
    expect(await smallTargets()).toEqual([]);

    await page.locator('nav[aria-label="Main"]').getByRole('link', { name: 'Surveys' }).click();
    await page.getByLabel('Locality').waitFor();
    await page.waitForLoadState('networkidle');
    expect(await scrollWidth()).toBeLessThanOrEqual(360);
    expect(await smallTargets()).toEqual([]);
    // Readable text: nothing in the form below 13 px (hints are 0.85 rem; labels and fields larger).
    const smallest = await page.evaluate(() =>
      Math.min(...[...document.querySelectorAll('main form label, main form input, main form p, main form legend')].map((e) => parseFloat(getComputedStyle(e).fontSize))),
    );
    expect(smallest).toBeGreaterThanOrEqual(13);
  });

  it('when the phone goes offline and the survey page is reloaded, then it opens from the service worker, keeps the survey, and the server gets it exactly once back online', async () => {
    const locality = 'Lantern Quay';
    expect(await count(locality)).toBe(0);
    await context.setOffline(true);
    const response = await page.reload();
    expect(response?.fromServiceWorker()).toBe(true);
    await page.getByLabel('Locality').waitFor();
    expect(await page.evaluate(() => navigator.onLine)).toBe(false);
    // A banner under the menu says the phone is offline.
    await page.getByTestId('offline-banner').waitFor();
    expect(await scrollWidth()).toBeLessThanOrEqual(360);

    await page.getByLabel('Locality').fill(locality);
    await page.getByLabel('Houses inspected').fill('25');
    await page.getByLabel('Houses with larvae or pupae').fill('3');
    await page.getByLabel('Water-holding containers inspected').fill('70');
    await page.getByLabel('Containers with larvae or pupae').fill('5');
    await page.getByLabel('bucket or jar').check();
    await page.getByRole('button', { name: 'Save the survey' }).click();
    await page.getByRole('status').getByText(/saved on this device/).waitFor();
    await page.getByTestId('survey-outbox').getByText(locality).waitFor();
    expect(await count(locality)).toBe(0);

    await context.setOffline(false);
    await page.getByTestId('survey-outbox').getByText(/Nothing waiting/).waitFor({ timeout: 15_000 });
    expect(await count(locality)).toBe(1);
    // Reloading online resends nothing.
    await page.reload();
    await page.getByTestId('survey-outbox').getByText(/Nothing waiting/).waitFor();
    expect(await count(locality)).toBe(1);
  });

  it('when the app asks for /api offline, then the service worker gives no cached answer', async () => {
    await context.setOffline(true);
    const outcome = await page.evaluate(async () => {
      try {
        const r = await fetch('/api/me', { headers: { Accept: 'application/json' } });
        return `answered ${r.status}`;
      } catch {
        return 'network error';
      }
    });
    await context.setOffline(false);
    expect(outcome).toBe('network error');
  });
});
