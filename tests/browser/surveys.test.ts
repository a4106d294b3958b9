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

describe('a larval survey in the field', () => {
  it('when the community worker fills a survey at 360 px while offline, then it is kept on the phone and sent once the connection is back', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
    await page.goto(server.baseUrl + '/sign-in');
    await page.getByLabel('E-mail').fill('worker@halvern.example');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('current-role').waitFor();
    await page.locator('nav[aria-label="Main"]').getByRole('link', { name: 'Surveys' }).click();
    await page.getByLabel('Locality').waitFor();
    // Nothing wider than the phone's screen.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);

    await context.setOffline(true);
    await page.getByLabel('Locality').fill('Breakwater Steps');
    await page.getByLabel('Houses inspected').fill('40');
    await page.getByLabel('Houses with larvae or pupae').fill('6');
    await page.getByLabel('Water-holding containers inspected').fill('120');
    await page.getByLabel('Containers with larvae or pupae').fill('9');
    await page.getByLabel('Pupae counted').fill('14');
    await page.getByLabel('tyre').check();
    await page.getByRole('button', { name: 'Save the survey' }).click();
    await page.getByRole('status').getByText(/saved on this device/).waitFor();
    await page.getByTestId('survey-outbox').getByText('Breakwater Steps').waitFor();
    const count = async () =>
      Number((await server.ds.query(`SELECT count(*)::int AS n FROM larval_surveys WHERE locality = 'Breakwater Steps'`))[0].n);
    expect(await count()).toBe(0);

    await context.setOffline(false);
    await page.getByTestId('survey-outbox').getByText(/Nothing waiting/).waitFor({ timeout: 10_000 });
    expect(await count()).toBe(1);
    // A reload resends nothing: the outbox is empty and the survey is stored once.
    await page.reload();
    await page.getByTestId('survey-outbox').getByText(/Nothing waiting/).waitFor();
    expect(await count()).toBe(1);
    await context.close();
  });

  it('when the pages were used, then the browser logged no errors other than the offline attempt', () => {
    expect(consoleErrors.filter((e) => !/401|ERR_INTERNET_DISCONNECTED|Failed to fetch|net::/.test(e))).toEqual([]);
  });
});
