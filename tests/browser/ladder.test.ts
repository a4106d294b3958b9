import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { startDemoBrowser, type LiveServer } from '../support/demo-browser';

let server: LiveServer;
let browser: Browser;
let stop: (() => Promise<void>) | undefined;
const problems: string[] = [];

beforeAll(async () => {
  ({ server, browser, stop } = await startDemoBrowser());
});
afterAll(() => stop?.());

async function signInAsOfficer(): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  page.on('console', (m) => {
    if (m.type() === 'error' || /Content[- ]Security[- ]Policy/i.test(m.text())) problems.push(m.text());
  });
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  await page.goto(server.baseUrl + '/');
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel('E-mail').fill('officer@halvern.example');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('current-role').waitFor();
  return page;
}

const districtCodes = (page: Page) => page.locator('.ladder-table tbody tr[data-district]').evaluateAll((trs) => trs.map((tr) => tr.getAttribute('data-district')));

describe('the Ladder, the region map and the District file in the browser', () => {
  it('when the officer sorts the Ladder and opens a district from the map, then the District file draws every chart', async () => {
    const page = await signInAsOfficer();
    await page.getByRole('heading', { level: 1, name: 'Ladder' }).waitFor();
    await page.locator('.ladder-table tbody tr[data-district]').first().waitFor();
    expect(await page.getByText('Demo data — the Halvern Region is invented').count()).toBeGreaterThan(0);
    expect(await page.getByText('Before you act on these estimates').isVisible()).toBe(true);

    const ranked = await districtCodes(page);
    expect(ranked.length).toBe(12);
    const districtHeader = page.locator('.ladder-table thead th', { has: page.getByRole('button', { name: /^District/ }) });
    await districtHeader.getByRole('button').click();
    expect(await districtHeader.getAttribute('aria-sort')).toBe('ascending');
    const names = await page.locator('.ladder-table tbody tr[data-district] th a').allInnerTexts();
    expect(names).toEqual([...names].sort((a, b) => a.localeCompare(b)));

    // The map itself is drawn (a canvas inside its box), and its keyboard equivalent lists every district.
    await page.locator('[data-testid="region-map"] canvas').first().waitFor();
    const mapLinks = page.locator('ul[aria-label="Districts on the map"] a');
    expect(await mapLinks.count()).toBe(12);
    const first = mapLinks.first();
    const name = (await first.locator('span.truncate').innerText()).trim();
    await first.focus();
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/districts\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { level: 1, name }).waitFor();

    // Every chart container holds a drawing (canvas or svg) once ECharts has loaded.
    await page.locator('figure[data-chart]').first().waitFor();
    await page.locator('figure[data-chart] [data-testid="chart-box"] canvas').first().waitFor();
    const charts = await page.locator('figure[data-chart]').evaluateAll((figs) =>
      figs.map((f) => ({
        title: f.getAttribute('data-chart'),
        box: !!f.querySelector('[data-testid="chart-box"]'),
        drawn: !!f.querySelector('[data-testid="chart-box"] canvas, [data-testid="chart-box"] svg'),
      })),
    );
    expect(charts.length).toBeGreaterThanOrEqual(5);
    for (const title of ['Daily temperature and humidity', 'Tier history and its drivers']) expect(charts.map((c) => c.title)).toContain(title);
    expect(charts.filter((c) => c.box && !c.drawn)).toEqual([]);
    expect(await page.getByText('Drivers behind this tier').count()).toBe(1);
    expect(await page.getByText('Before you act on these estimates').isVisible()).toBe(true);
    await page.context().close();
  });

  it('when the pages were used, then the browser logged no console errors and no Content-Security-Policy violations', () => {
    // The one expected 401 is the first /api/me, before signing in (as in sign-in.test.ts).
    expect(problems.filter((e) => !/status of 401/.test(e))).toEqual([]);
  });
});
