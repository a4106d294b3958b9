import { readFileSync } from 'node:fs';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoIfEmpty } from '../../sample/seed-demo';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { runSeasonNow } from '../../server/season/season-run.service';
import { launchBrowser } from '../support/browser';
import { signedInAgent } from '../support/factories';
import { startLiveServer } from '../support/live-server';

/**
 * Fast on a field phone (issue 20): the built client's files leave the server pre-compressed with the
 * right Content-Encoding, hashed files are cached a year as immutable while index.html is revalidated,
 * API answers are compressed, and a French user's first visit fetches French texts only. The speed itself
 * is measured by `npm run bench:phone` (bench/phone.bench.ts), not here.
 */
let server: Awaited<ReturnType<typeof startLiveServer>>;
let browser: Browser;

beforeAll(async () => {
  server = await startLiveServer();
  await seedDemoIfEmpty(server.ds, { nodeEnv: 'test', bcryptCost: 4 });
  await runSeasonNow(server.ctx);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const entryScript = () => /<script type="module" crossorigin src="([^"]+)"/.exec(readFileSync('dist/client/index.html', 'utf8'))![1];

describe('the built client on a slow network', () => {
  it('when the entry script is asked for with brotli, gzip or neither accepted, then it is sent br, gzip or plain with the same content, cached a year as immutable', async () => {
    const src = entryScript();
    expect(src).toMatch(/^\/assets\/index-[\w-]+\.js$/);
    const plainFile = readFileSync(`dist/client${src}`, 'utf8');
    for (const [accept, encoding] of [['br, gzip', 'br'], ['gzip', 'gzip'], ['identity', null]] as const) {
      const res = await fetch(server.baseUrl + src, { headers: { 'accept-encoding': accept } });
      expect(res.status, accept).toBe(200);
      expect(res.headers.get('content-encoding'), accept).toBe(encoding);
      expect(res.headers.get('content-type'), accept).toMatch(/javascript/);
      expect(res.headers.get('cache-control'), accept).toBe('public, max-age=31536000, immutable');
      expect(res.headers.get('vary'), accept).toMatch(/accept-encoding/i);
      expect(await res.text(), accept).toBe(plainFile); // fetch decodes br and gzip
    }
  });

  it('when index.html, a client route, the service worker or the manifest is asked for, then each is revalidated on every visit (no-cache), index.html compressed', async () => {
    for (const p of ['/', '/sign-in', '/index.html', '/sw.js', '/manifest.webmanifest']) {
      const res = await fetch(server.baseUrl + p, { headers: { accept: 'text/html,*/*', 'accept-encoding': 'gzip' } });
      await res.arrayBuffer();
      expect(res.status, p).toBe(200);
      expect(res.headers.get('cache-control'), p).toBe('no-cache');
    }
    const shell = await fetch(server.baseUrl + '/sign-in', { headers: { accept: 'text/html', 'accept-encoding': 'br, gzip' } });
    expect(shell.headers.get('content-encoding')).toMatch(/^(br|gzip)$/);
    expect(await shell.text()).toContain('<div id="root">');
  });

  it('when a large API answer is asked for with gzip accepted, then it comes gzip-compressed and still never stored (no-store)', async () => {
    const agent = await signedInAgent(server.app, 'officer@halvern.example', DEMO_PASSWORD);
    const res = await agent.get('/api/districts/boundaries').set('accept-encoding', 'gzip');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.body.features.length).toBeGreaterThan(0);
  });

  it('when a French user opens Broodcast for the first time and signs in, then the Ladder is in French and no English, Spanish or Portuguese texts were fetched', async () => {
    await server.ds.query(`UPDATE users SET language = 'fr' WHERE email = 'officer@halvern.example'`);
    const context = await browser.newContext({ locale: 'fr-FR', viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, serviceWorkers: 'block' });
    const page = await context.newPage();
    const requested: string[] = [];
    page.on('request', (r) => requested.push(new URL(r.url()).pathname));
    await page.goto(server.baseUrl + '/sign-in');
    await page.locator('input[type="email"]').fill('officer@halvern.example');
    await page.locator('input[type="password"]').fill(DEMO_PASSWORD);
    await page.locator('form button[type="submit"]').click();
    await page.locator('.ladder-table tbody tr[data-district]').first().waitFor();
    await page.waitForLoadState('networkidle');
    expect(await page.evaluate(() => document.documentElement.lang)).toBe('fr');
    const texts = requested.filter((p) => p.startsWith('/assets/texts-'));
    // The sign-in page's and the Ladder's namespaces, in French only.
    for (const ns of ['common', 'app', 'auth', 'ladder']) expect(texts.some((p) => p.startsWith(`/assets/texts-fr-${ns}-`)), ns).toBe(true);
    expect(texts.filter((p) => !p.startsWith('/assets/texts-fr-'))).toEqual([]);
    // No screen's code but the two that were opened (and the layout): the others wait until they are needed.
    expect(requested.filter((p) => /\/assets\/(district-file\.page|case-ledger\.page|intake\.page|surveys\.page)-/.test(p))).toEqual([]);
    await context.close();
  });
});
