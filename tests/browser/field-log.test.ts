import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoIfEmpty } from '../../sample/seed-demo';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { launchBrowser } from '../support/browser';
import { startLiveServer } from '../support/live-server';

let server: Awaited<ReturnType<typeof startLiveServer>>;
let browser: Browser;
const consoleErrors: string[] = [];

beforeAll(async () => {
  server = await startLiveServer();
  await seedDemoIfEmpty(server.ds, { nodeEnv: 'test', bcryptCost: 4 });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('a piece of field work recorded on a phone', () => {
  it('when the community worker records work at 360 px while offline, then it is kept, arrives once when back online, and the District file shows it', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
    await page.goto(server.baseUrl + '/sign-in');
    await page.getByLabel('E-mail').fill('worker@halvern.example');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('current-role').waitFor();
    await page.locator('nav[aria-label="Main"]').getByRole('link', { name: 'Field log' }).click();
    await page.getByLabel('Locality').waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);

    await context.setOffline(true);
    await page.getByLabel('Locality').fill('Tidewall Lane');
    await page.getByLabel('Kind of work').selectOption('larviciding');
    await page.getByLabel('Houses visited').fill('35');
    await page.getByLabel('Product', { exact: true }).fill('Bti granules');
    await page.getByLabel('Amount').fill('250');
    await page.getByLabel('Unit').selectOption('g');
    await page.getByRole('button', { name: 'Save the record' }).click();
    await page.getByRole('status').getByText(/Saved on this device/).waitFor();
    await page.getByTestId('record-outbox').getByText('Tidewall Lane').waitFor();
    const rows = async () =>
      (await server.ds.query(`SELECT district_id, containers, area_m2 FROM field_records WHERE locality = 'Tidewall Lane'`)) as { district_id: string; containers: number | null; area_m2: number | null }[];
    expect(await rows()).toHaveLength(0);

    await context.setOffline(false);
    await page.getByTestId('record-outbox').getByText(/Nothing waiting/).waitFor({ timeout: 15_000 });
    expect(await rows()).toHaveLength(1);
    await page.reload();
    await page.getByTestId('record-outbox').getByText(/Nothing waiting/).waitFor();
    await page.getByTestId('sent-records').getByText(/Tidewall Lane/).waitFor();
    const stored = await rows();
    expect(stored).toHaveLength(1);
    // Left empty, so not given (null), never 0.
    expect(stored[0].containers).toBeNull();
    expect(stored[0].area_m2).toBeNull();

    await page.goto(`${server.baseUrl}/districts/${stored[0].district_id}`);
    const panel = page.getByTestId('field-work');
    await panel.getByText(/larviciding/).waitFor({ timeout: 20_000 });
    expect(await panel.textContent()).toContain('Tidewall Lane');
    expect(await panel.textContent()).toContain('35 houses visited');
    await context.close();
  });

  it('when the pages were used, then the browser logged no errors other than the offline attempt', () => {
    expect(consoleErrors.filter((e) => !/401|ERR_INTERNET_DISCONNECTED|Failed to fetch|net::/.test(e))).toEqual([]);
  });
});
