import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { startDemoBrowser, type LiveServer } from '../support/demo-browser';

/*
 * Every screen as its user meets it at 1280 × 800: the page scrolls, never a box inside it that hides table
 * columns or rows; and the charts speak the interface language (month names, number formats).
 */

let server: LiveServer;
let browser: Browser;
let stop: (() => Promise<void>) | undefined;
const problems: string[] = [];

beforeAll(async () => {
  ({ server, browser, stop } = await startDemoBrowser());
});
afterAll(() => stop?.());

async function signIn(email: string, language?: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, locale: 'en-GB', reducedMotion: 'reduce' });
  // Every text drawn on a chart's canvas is recorded, so the test reads what ECharts shows.
  await context.addInitScript(() => {
    const drawn: string[] = ((window as unknown as { __drawnText: string[] }).__drawnText = []);
    const fill = CanvasRenderingContext2D.prototype.fillText;
    CanvasRenderingContext2D.prototype.fillText = function (text: string, x: number, y: number, maxWidth?: number) {
      drawn.push(String(text));
      return maxWidth === undefined ? fill.call(this, text, x, y) : fill.call(this, text, x, y, maxWidth);
    };
  });
  const page = await context.newPage();
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  await page.goto(server.baseUrl + '/sign-in');
  await page.locator('input[type="email"]').fill(email);
  await page.locator('input[type="password"]').fill(DEMO_PASSWORD);
  await page.locator('form button[type="submit"]').click();
  await page.getByTestId('current-role').waitFor();
  if (language) {
    const status = await page.evaluate(
      (lng) =>
        fetch('/api/me/preferences', { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ language: lng }) }).then((r) => r.status),
      language,
    );
    expect(status).toBeLessThan(300);
  }
  return page;
}

async function settle(page: Page) {
  await page.waitForLoadState('networkidle');
  await page.waitForFunction(() => !/Loading|Chargement/.test(document.querySelector('main')?.textContent ?? ''), undefined, { timeout: 10_000 }).catch(() => undefined);
  await page.waitForTimeout(300);
}

/**
 * Tables (and the boxes around them) whose content is cut by a scroll box of their own: an ancestor of a
 * visible table, below <body>, that clips (overflow not visible) and holds more than it shows.
 */
const hiddenByScrollBoxes = (page: Page) =>
  page.evaluate(() => {
    const out: string[] = [];
    for (const table of document.querySelectorAll<HTMLTableElement>('main table')) {
      const r = table.getBoundingClientRect();
      if (r.width === 0 || r.height === 0) continue;
      for (let el = table.parentElement; el && el !== document.body; el = el.parentElement) {
        const cs = getComputedStyle(el);
        const clipsX = cs.overflowX !== 'visible' && el.scrollWidth > el.clientWidth + 1;
        const clipsY = cs.overflowY !== 'visible' && el.scrollHeight > el.clientHeight + 1;
        if (clipsX || clipsY) {
          const name = table.caption?.textContent?.trim() || table.querySelector('th')?.textContent?.trim() || 'table';
          out.push(`${name.slice(0, 50)}: ${el.tagName.toLowerCase()}.${[...el.classList].join('.')} shows ${el.clientWidth}×${el.clientHeight} of ${el.scrollWidth}×${el.scrollHeight}`);
          break;
        }
      }
    }
    return out;
  });

async function firstDistrictPath(page: Page) {
  await page.goto(server.baseUrl + '/');
  await page.locator('.ladder-table tbody tr[data-district] th a').first().waitFor();
  return (await page.locator('.ladder-table tbody tr[data-district] th a').first().getAttribute('href'))!;
}

const ROLES: { email: string; paths: (page: Page) => Promise<string[]> }[] = [
  {
    email: 'officer@halvern.example',
    paths: async (page) => {
      const file = await firstDistrictPath(page);
      return ['/', file, `${file}/cases`, '/intake', '/season-runs', '/advisories', '/surveys'];
    },
  },
  { email: 'epi@halvern.example', paths: async () => ['/cases'] },
  { email: 'supervisor@halvern.example', paths: async () => ['/sign-off', '/cases', '/bulletin'] },
  { email: 'admin@halvern.example', paths: async () => ['/admin/users', '/admin/districts'] },
  { email: 'worker@halvern.example', paths: async () => ['/', '/surveys', '/advisories'] },
];

describe('every page at 1280 × 800 and the charts in the interface language', () => {
  it.each(ROLES.map((r) => [r.email, r] as const))('when %s opens each of their pages at 1280 × 800, then no table is cut by a scroll box inside the page', async (_email, role) => {
    const page = await signIn(role.email);
    const found: string[] = [];
    for (const path of await role.paths(page)) {
      await page.goto(server.baseUrl + path);
      await settle(page);
      expect(await page.locator('main table').count(), `${path} shows a table or none`).toBeGreaterThanOrEqual(0);
      for (const p of await hiddenByScrollBoxes(page)) found.push(`${path} — ${p}`);
    }
    expect(found).toEqual([]);
    await page.context().close();
  });

  it('when the Ladder is open at 1280 × 800, then all its columns are inside the window and the page (not a box) scrolls to the last district', async () => {
    const page = await signIn('officer@halvern.example');
    await page.goto(server.baseUrl + '/');
    await page.locator('.ladder-table tbody tr[data-district]').first().waitFor();
    const right = await page.locator('.ladder-table thead th').last().evaluate((th) => th.getBoundingClientRect().right);
    expect(right).toBeLessThanOrEqual(1280);
    expect(await page.locator('.ladder-table tbody tr[data-district]').count()).toBe(12);
    expect(await page.evaluate(() => document.documentElement.scrollHeight)).toBeGreaterThan(800);
    await page.context().close();
  });

  it('when the interface is French, then the District file charts show French month names and French number formats', async () => {
    const page = await signIn('officer@halvern.example', 'fr');
    const file = await firstDistrictPath(page);
    await page.goto(server.baseUrl + file);
    await page.locator('figure[data-chart] [data-testid="chart-box"] canvas').first().waitFor();
    await page.waitForTimeout(1500);
    const drawn: string[] = await page.evaluate(() => (window as unknown as { __drawnText: string[] }).__drawnText);
    const words = new Set(drawn.map((s) => s.trim()));
    // ECharts' French month abbreviations (echarts/lib/i18n/langFR.js), not the English ones.
    expect([...words].filter((w) => ['Fév', 'Avr', 'Mai', 'Juin', 'Juil', 'Août', 'Déc'].includes(w)).length).toBeGreaterThan(0);
    expect([...words].filter((w) => ['Feb', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Dec'].includes(w))).toEqual([]);
    // Numbers: no "5,000" or "0.4"; thousands are grouped with a (narrow) no-break space.
    expect([...words].filter((w) => /^-?\d{1,3}(,\d{3})+$/.test(w) || /^-?\d+\.\d+$/.test(w))).toEqual([]);
    expect([...words].some((w) => /^\d{1,3}[\u202f\u00a0]\d{3}$/.test(w))).toBe(true);
    // Profile names in chart titles follow the language too.
    expect(await page.locator('figure[data-chart]').first().locator('xpath=..').locator('text=with dengue virus').count()).toBe(0);
    expect(await page.getByText('Aedes aegypti et virus de la dengue').count()).toBeGreaterThan(0);
    await page.context().close();
  });

  it('when the printable District file is opened in French and printed, then its tier history fits the page and its title is French', async () => {
    // Issue 21: the printable page showed "Select ?", cut off its tier-history table and kept an English title.
    const page = await signIn('officer@halvern.example', 'fr');
    const file = await firstDistrictPath(page);
    await page.goto(`${server.baseUrl}${file}/print`);
    await page.locator('.print-page').waitFor();
    await settle(page);
    expect(await page.title()).toMatch(/ · .*imprim.* · Broodcast$/i);
    expect(await page.locator('.key-numbers').innerText()).not.toContain('?');
    // On screen at 1280 px, then as printed on A4 (210 mm less 12 mm margins each side ≈ 700 CSS px wide).
    for (const [media, width] of [['screen', 1280], ['print', 700]] as const) {
      await page.setViewportSize({ width, height: 900 });
      await page.emulateMedia({ media });
      const cut = await page.locator('.print-page table').evaluateAll((tables) =>
        tables
          .filter((t) => t.getBoundingClientRect().width > 0)
          .map((t) => ({ name: (t as HTMLTableElement).caption?.textContent ?? '', over: t.getBoundingClientRect().right - t.closest('.print-page')!.getBoundingClientRect().right }))
          .filter((x) => x.over > 1),
      );
      expect(cut, media).toEqual([]);
    }
    await page.context().close();
  });

  it('when the pages were used, then none threw an error', () => {
    expect(problems).toEqual([]);
  });
});
