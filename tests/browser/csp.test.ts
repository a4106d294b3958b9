import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoIfEmpty } from '../../sample/seed-demo';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { runSeasonNow } from '../../server/season/season-run.service';
import { launchBrowser } from '../support/browser';
import { startLiveServer } from '../support/live-server';

/**
 * The Content-Security-Policy in a real browser (OWASP ASVS 5.0 V3.4.3, V3.4.6): Chromium opens the
 * main screens and records every `securitypolicyviolation` event and every console message about the
 * policy. None is allowed: the app runs on its own scripts, styles and fonts only.
 */
let server: Awaited<ReturnType<typeof startLiveServer>>;
let browser: Browser;
let districtId: string;

beforeAll(async () => {
  server = await startLiveServer();
  await seedDemoIfEmpty(server.ds, { nodeEnv: 'test', bcryptCost: 4 });
  await runSeasonNow(server.ctx);
  districtId = (await server.ds.query(`SELECT id FROM districts WHERE is_demo ORDER BY code LIMIT 1`))[0].id;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

interface Watched {
  context: BrowserContext;
  page: Page;
  violations: string[];
}

async function watchedPage(): Promise<Watched> {
  const context = await browser.newContext();
  const violations: string[] = [];
  await context.exposeBinding('__reportCspViolation', (_source, text: string) => void violations.push(text));
  await context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { __reportCspViolation: (t: string) => void }).__reportCspViolation(
        `${e.violatedDirective} blocked ${e.blockedURI || '(inline)'} at ${e.sourceFile}:${e.lineNumber}`,
      );
    });
  });
  const page = await context.newPage();
  page.on('console', (m) => {
    if (/Content[- ]Security[- ]Policy|Refused to (load|execute|apply|connect|frame)/i.test(m.text())) violations.push(`console: ${m.text()}`);
  });
  return { context, page, violations };
}

/** Open a screen, let its data and charts load, and return the document's answer. */
async function visit(page: Page, path: string) {
  const res = await page.goto(server.baseUrl + path, { waitUntil: 'networkidle' });
  await page.locator('h1, main').first().waitFor({ timeout: 15_000 });
  await page.waitForTimeout(300);
  return res!;
}

describe('Content-Security-Policy in the browser', () => {
  it('when Chromium opens sign-in, the Ladder, a District file, the case ledger and the sign-off queue, then no policy violation is reported', async () => {
    const { context, page, violations } = await watchedPage();
    const signInPage = await visit(page, '/sign-in');
    await page.locator('input[type="password"]').waitFor();

    // Sign in as the demo supervisor through the API; the browser context keeps the cookie.
    const signIn = await context.request.post(server.baseUrl + '/api/auth/sign-in', {
      data: { email: 'supervisor@halvern.example', password: DEMO_PASSWORD },
    });
    expect(signIn.status()).toBe(200);

    const screens = ['/', `/districts/${districtId}`, '/cases', `/districts/${districtId}/cases`, '/sign-off'];
    for (const screen of screens) await visit(page, screen);
    await page.locator('canvas').first().waitFor({ state: 'attached', timeout: 15_000 }).catch(() => undefined);

    expect(violations).toEqual([]);
    console.log(`[security] screens opened in Chromium: ${screens.length + 1}; CSP violations: ${violations.length}`);

    // The document's own headers.
    const h = signInPage.headers();
    expect(h['content-security-policy']).toMatch(/script-src 'self'/);
    expect(h['content-security-policy']).toMatch(/frame-ancestors 'none'/);
    expect(h['x-content-type-options']).toBe('nosniff');
    expect(h['referrer-policy']).toBe('no-referrer');
    expect(h['strict-transport-security']).toMatch(/max-age=\d+/);
    await context.close();
  });

  it('when a page tries an inline script, an inline style element or a script from elsewhere, then the policy blocks each and reports it', async () => {
    const { context, page, violations } = await watchedPage();
    await visit(page, '/sign-in');
    const ran = await page.evaluate(async () => {
      const w = window as unknown as { __inlineRan?: boolean };
      const s = document.createElement('script');
      s.textContent = 'window.__inlineRan = true';
      document.body.append(s);
      const style = document.createElement('style');
      style.textContent = 'body { outline: 9px solid red }';
      document.head.append(style);
      const remote = document.createElement('script');
      remote.src = 'http://127.0.0.1:9/evil.js';
      document.body.append(remote);
      await new Promise((r) => setTimeout(r, 300));
      return w.__inlineRan === true;
    });
    expect(ran).toBe(false);
    expect(violations.join('\n')).toMatch(/script-src/);
    expect(violations.join('\n')).toMatch(/style-src/);
    await context.close();
  });
});
