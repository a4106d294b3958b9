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
  // This file's own database gets the invented demo region, as `npm start` would load it.
  await seedDemoIfEmpty(server.ds, { nodeEnv: 'test', bcryptCost: 4 });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function signIn(email: string) {
  const context = await browser.newContext();
  const page = await context.newPage();
  page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
  await page.goto(server.baseUrl + '/');
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('current-role').waitFor();
  return { page, context };
}

const navLabels = async (page: import('playwright-core').Page) =>
  (await page.locator('nav[aria-label="Main"] a').allInnerTexts()).map((s) => s.trim());

describe('signing in through the browser', () => {
  it('when the admin signs in, then the navigation offers the Ladder, Users and Districts, and the users screen lists the demo users', async () => {
    const { page, context } = await signIn('admin@halvern.example');
    expect(await page.getByTestId('current-role').innerText()).toContain('Admin');
    const labels = await navLabels(page);
    expect(labels.slice(0, 3)).toEqual(['Ladder', 'Users', 'Districts']);
    expect(labels).toContain('Season runs');
    await page.locator('nav[aria-label="Main"]').getByRole('link', { name: 'Users' }).click();
    await page.getByText('worker@halvern.example').waitFor();
    await context.close();
  });

  it('when the community worker signs in, then the Ladder and Surveys are offered but no admin, ledger or intake screen, with their one district, and admin screens say not allowed', async () => {
    const { page, context } = await signIn('worker@halvern.example');
    expect(await page.getByTestId('current-role').innerText()).toContain('Community worker');
    const workerLabels = await navLabels(page);
    expect(workerLabels.slice(0, 2)).toEqual(['Ladder', 'Surveys']);
    for (const hidden of ['Users', 'Districts', 'Case ledger', 'Intake']) expect(workerLabels).not.toContain(hidden);
    await page.getByText('Saltmere').first().waitFor();
    expect(await page.getByText('Korrin Bay').count()).toBe(0);
    await page.goto(server.baseUrl + '/admin/users');
    await page.getByText(/not allowed/i).first().waitFor();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await context.close();
  });

  it('when the pages were used, then the browser logged no errors', () => {
    expect(consoleErrors.filter((e) => !/401/.test(e))).toEqual([]);
  });
});
