import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoIfEmpty } from '../../sample/seed-demo';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { launchBrowser } from '../support/browser';
import { makeDrivers, makeTier } from '../support/flags-factories';
import { startLiveServer } from '../support/live-server';

let server: Awaited<ReturnType<typeof startLiveServer>>;
let browser: Browser;
const consoleErrors: string[] = [];

beforeAll(async () => {
  server = await startLiveServer();
  await seedDemoIfEmpty(server.ds, { nodeEnv: 'test', bcryptCost: 4 });
  // A Ladder to plan from: four demo districts with tiers, as a season run would store them.
  const rows: { id: string; code: string }[] = await server.ds.query(`SELECT id, code FROM districts WHERE code IN ('HV-01', 'HV-02', 'HV-03', 'HV-04') ORDER BY code`);
  const tiers = [['critical', 0.9, 'larval'], ['high', 0.7, 'cases'], ['raised', 0.5, 'climate'], ['baseline', 0.1, 'climate']] as const;
  for (const [i, d] of rows.entries()) {
    await makeTier(server.ds, { districtId: d.id, epiWeek: 48, tier: tiers[i][0], drivers: makeDrivers({ [tiers[i][2]]: tiers[i][1] }) });
    await server.ds.query(`UPDATE district_tiers SET leading_driver = $2 WHERE district_id = $1`, [d.id, tiers[i][2]]);
  }
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('the Field week in the browser', () => {
  it('when the health officer adds a team, asks for a proposal, changes a day and publishes, then the week is published and the team member is mailed', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
    page.on('pageerror', (e) => consoleErrors.push(String(e)));
    await page.goto(server.baseUrl + '/sign-in');
    await page.getByLabel('E-mail').fill('officer@halvern.example');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('current-role').waitFor();
    await page.locator('nav[aria-label="Main"]').getByRole('link', { name: 'Field week' }).click();
    await page.getByRole('heading', { name: 'Field week', level: 1 }).waitFor();

    const [base] = await server.ds.query(`SELECT name FROM districts WHERE code = 'HV-01'`);
    await page.getByLabel('Team name').fill('Coast team');
    await page.getByRole('group', { name: 'Base district' }).getByLabel(`${base.name} · HV-01`).check();
    await page.getByLabel('larviciding').check();
    await page.getByLabel('case investigation').check();
    await page.getByLabel('community clean-up').check();
    await page.getByLabel('District-days it can work a week').fill('5');
    await page.getByLabel('Mira Holloway').check();
    await page.getByRole('button', { name: 'Add the team' }).click();
    await page.getByText('Team Coast team added.').waitFor();

    await page.getByLabel('Travel limit from a team\'s base (km)').fill('2000');
    await page.getByRole('button', { name: 'Propose the week' }).click();
    await page.getByText(/Risk covered by the proposal/).waitFor();
    await page.getByText(/Out: at Baseline, no visit is needed/).waitFor();

    // Friday: pick the second district of the Ladder by hand, save, publish.
    const friday = page.locator('select').last();
    const secondOption = await friday.locator('option').nth(2).getAttribute('value');
    await friday.selectOption(secondOption!);
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.getByText(/changed by hand/).waitFor();
    await page.getByRole('button', { name: 'Publish to the teams' }).click();
    await page.getByText('1 team member was sent their days.').waitFor();

    const [week] = await server.ds.query(`SELECT status, edited FROM field_weeks`);
    expect(week).toEqual({ status: 'published', edited: true });
    const [mail] = await server.ds.query(`SELECT count(*)::int AS n FROM outbox_messages WHERE kind = 'field-week' AND to_address = 'worker@halvern.example'`);
    expect(mail.n).toBe(1);
    await context.close();
  });

  it('when the page was used, then the browser logged no errors', () => {
    expect(consoleErrors).toEqual([]);
  });
});
