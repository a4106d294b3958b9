import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { startDemoBrowser, type LiveServer } from '../support/demo-browser';

/*
 * The screenshots in the README (docs/screenshots/): the Ladder and a District file with the demo data, at
 * phone and desktop size, full page. They are always taken and checked; they are written to the checkout
 * only with SCREENSHOTS=1, so an ordinary `npm test` leaves the tree clean:
 *   SCREENSHOTS=1 npm test -- tests/browser/screenshots.test.ts
 */

const WRITE = process.env.SCREENSHOTS === '1';
const OUT_DIR = fileURLToPath(new URL('../../docs/screenshots/', import.meta.url));
const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

const SIZES = {
  phone: { viewport: { width: 360, height: 740 }, deviceScaleFactor: 1, isMobile: true, hasTouch: true },
  desktop: { viewport: { width: 1280, height: 800 }, deviceScaleFactor: 1, isMobile: false, hasTouch: false },
} as const;

let server: LiveServer;
let browser: Browser;
let stop: (() => Promise<void>) | undefined;
const problems: string[] = [];

// As `npm start` does on a fresh installation: the last eight weeks' tiers, then today's, so the
// pictures show "since last week" and a tier history.
beforeAll(async () => {
  ({ server, browser, stop } = await startDemoBrowser({ runs: 'startup' }));
});
afterAll(() => stop?.());

async function signedInPage(size: keyof typeof SIZES, email = 'officer@halvern.example'): Promise<Page> {
  const context = await browser.newContext({ ...SIZES[size], locale: 'en-GB', reducedMotion: 'reduce' });
  await context.addInitScript(() => {
    try {
      window.localStorage.setItem('broodcast.language', 'en');
    } catch {
      // no storage: the context's locale applies
    }
  });
  const page = await context.newPage();
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  await page.goto(server.baseUrl + '/sign-in');
  await page.locator('input[type="email"]').fill(email);
  await page.locator('input[type="password"]').fill(DEMO_PASSWORD);
  await page.locator('form button[type="submit"]').click();
  await page.getByTestId('current-role').waitFor();
  return page;
}

/** Waits until every chart box holds its drawing and ECharts has had time to finish its first animation. */
async function chartsDrawn(page: Page, selector: string) {
  await page.waitForFunction((sel) => {
    const boxes = [...document.querySelectorAll(sel)];
    return boxes.length > 0 && boxes.every((b) => b.querySelector('canvas, svg'));
  }, selector);
  await page.evaluate(() => document.fonts.ready.then(() => undefined));
  await page.waitForTimeout(1500);
}

async function openLadder(page: Page) {
  await page.goto(server.baseUrl + '/');
  await page.locator('.ladder-table tbody tr[data-district]').first().waitFor();
  await mapDrawn(page);
}

/** On a phone the region map loads only when scrolled near (src/lib/use-near-viewport.ts): scroll to it, wait, come back. */
async function mapDrawn(page: Page) {
  await page.locator('[data-tour="region-map"]').scrollIntoViewIfNeeded();
  await chartsDrawn(page, '[data-testid="region-map"]');
  await page.evaluate(() => window.scrollTo(0, 0));
}

/** The district the Ladder ranks first: the highest tier of the week, so the file has something to show. */
async function openDistrictFile(page: Page) {
  await openLadder(page);
  const top = page.locator('.ladder-table tbody tr[data-district]').first();
  const tier = await top.locator('[data-tier]').first().getAttribute('data-tier');
  expect(tier).not.toBe('baseline');
  const href = await top.locator('th a').getAttribute('href');
  await page.goto(server.baseUrl + href);
  await page.locator('figure[data-chart]').first().waitFor();
  await chartsDrawn(page, 'figure[data-chart] [data-testid="chart-box"]');
}

/** A PNG's width and height from its IHDR chunk. */
function pngSize(png: Buffer) {
  return { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
}

async function shoot(page: Page, name: string, size: keyof typeof SIZES) {
  // Nothing half-loaded in the picture: no loading line, no error notice.
  expect(await page.locator('main').innerText()).not.toMatch(/Loading|Something went wrong/);
  const png = await page.screenshot({ fullPage: true, animations: 'disabled', caret: 'hide' });
  expect(png.subarray(0, 8).equals(PNG_SIGNATURE)).toBe(true);
  const { width, height } = pngSize(png);
  expect(width).toBe(SIZES[size].viewport.width * SIZES[size].deviceScaleFactor);
  expect(height).toBeGreaterThanOrEqual(SIZES[size].viewport.height * SIZES[size].deviceScaleFactor);
  expect(png.length).toBeGreaterThan(20_000);
  if (WRITE) {
    mkdirSync(OUT_DIR, { recursive: true });
    writeFileSync(path.join(OUT_DIR, `${name}-${size}.png`), png);
  }
}

describe('screenshots of the Ladder and a District file for the docs', () => {
  it.each(['phone', 'desktop'] as const)('when the officer opens the Ladder on a %s, then a full-page screenshot shows the ranked districts and the map', async (size) => {
    const page = await signedInPage(size);
    await openLadder(page);
    expect(await page.locator('.ladder-table tbody tr[data-district]').count()).toBe(12);
    // Issue 21: the columns the Ladder opens with fit the width (a phone: rank, district, tier, since last week).
    const overflow = await page.locator('.ladder-scroll').evaluate((el) => ({ over: el.scrollWidth - el.clientWidth, rows: [...el.querySelectorAll('tbody tr[data-district]')].map((r) => r.getBoundingClientRect().height) }));
    expect(overflow.over).toBeLessThanOrEqual(1);
    for (const h of overflow.rows) expect(h).toBeLessThanOrEqual(61);
    await shoot(page, 'ladder', size);
    await page.context().close();
  });

  it.each(['phone', 'desktop'] as const)('when the officer opens the top district’s District file on a %s, then a full-page screenshot shows its tier and drawn charts', async (size) => {
    const page = await signedInPage(size);
    await openDistrictFile(page);
    await shoot(page, 'district-file', size);
    await page.context().close();
  });

  it('when the community worker opens Broodcast on a phone, then the first screen leads with their district and its advisories, the cautions one tap away', async () => {
    const page = await signedInPage('phone', 'worker@halvern.example');
    await page.goto(server.baseUrl + '/');
    await page.getByTestId('worker-home').waitFor();
    await page.locator('.ladder-table tbody tr[data-district]').first().waitFor();
    await mapDrawn(page);
    // The worker's district is in the first screenful; the cautions are folded, one tap away.
    const top = await page.getByRole('heading', { name: /Your district: Saltmere/ }).evaluate((h) => h.getBoundingClientRect().top);
    expect(top).toBeLessThan(SIZES.phone.viewport.height - 120);
    expect(await page.locator('[data-testid="worker-home"] details').getAttribute('open')).toBeNull();
    await shoot(page, 'worker-home', 'phone');
    await page.context().close();
  });

  it('when the screenshots were taken, then the pages threw no errors', () => {
    expect(problems).toEqual([]);
  });
});
