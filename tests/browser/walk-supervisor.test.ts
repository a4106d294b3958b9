import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { ACTION_IDS } from '../../shared/api/flags.schema';
import { startDemoBrowser, type LiveServer } from '../support/demo-browser';
import { signedInAgent } from '../support/factories';
import { WALK_TIMEOUT, walkAs } from '../support/walk';

/*
 * The supervisor's week: the Sign-off queue (one flag approved as proposed, one rejected with a reason),
 * a count's revision history in the Case ledger, and the week's bulletin preview. Two flags raised by the
 * health officer are the set-up (through the API). Fails on any 5xx answer or console error.
 */

let server: LiveServer;
let browser: Browser;
let stop: (() => Promise<void>) | undefined;
const APPROVE_NOTE = 'Standing water after the storm in the Korrin Bay harbour yards.';
const REJECT_NOTE = 'Two fever cases at the Hestfield school, both travellers back from the coast.';

beforeAll(async () => {
  ({ server, browser, stop } = await startDemoBrowser());
  const officer = await signedInAgent(server.app, 'officer@halvern.example', DEMO_PASSWORD);
  const { districts } = (await officer.get('/api/districts')).body as { districts: { id: string; code: string }[] };
  for (const [code, note] of [['HV-02', APPROVE_NOTE], ['HV-07', REJECT_NOTE]] as const) {
    const districtId = districts.find((d) => d.code === code)!.id;
    const res = await officer.post('/api/flags').send({ districtId, note, actions: [...ACTION_IDS] });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  }
});
afterAll(() => stop?.());

const flagOf = async (note: string) =>
  (await server.ds.query(`SELECT status, decision_reason FROM flags WHERE note = $1`, [note]))[0] as { status: string; decision_reason: string | null };

describe("the supervisor's week", () => {
  it('when the supervisor approves one flag, rejects another with a reason, reads a count’s history and the bulletin, then every screen answers without a server or console error', async () => {
    const w = await walkAs(browser, server, 'supervisor', 'supervisor@halvern.example');
    const { page } = w;

    await w.go('Sign-off');
    const queue = page.getByRole('list', { name: 'Flags waiting for sign-off' });
    const item = (note: string) => queue.locator(':scope > li', { hasText: note });
    await item(APPROVE_NOTE).waitFor();
    await item(REJECT_NOTE).waitFor();
    await w.shot('sign-off-queue');

    // The harbour flag, approved with the message Broodcast proposed.
    await item(APPROVE_NOTE).getByRole('button', { name: 'Approve and send the advisory' }).click();
    await item(APPROVE_NOTE).waitFor({ state: 'detached' });
    expect(await flagOf(APPROVE_NOTE)).toMatchObject({ status: 'approved' });

    // The school flag, rejected with the reason.
    const reject = item(REJECT_NOTE);
    await reject.getByRole('radio', { name: 'Reject' }).check();
    await reject.getByLabel('Why reject it? (kept in the flag’s history)').fill('Imported cases, no local transmission: followed up by the clinic.');
    await w.shot('rejecting');
    await reject.getByRole('button', { name: 'Reject the flag' }).click();
    await reject.waitFor({ state: 'detached' });
    expect(await flagOf(REJECT_NOTE)).toEqual({ status: 'rejected', decision_reason: 'Imported cases, no local transmission: followed up by the clinic.' });
    await w.shot('decided');

    // The approved flag is now an advisory.
    await w.go('Advisories');
    await page.getByTestId('advisories').getByRole('heading', { name: 'Korrin Bay (HV-02)' }).waitFor();

    // A count's history: Saltmere's dengue, last reported week.
    await w.go('Case ledger');
    const grid = page.locator('table.case-grid');
    await grid.waitFor();
    const recorded = grid.getByRole('button', { name: /^HV-01 W\d+ \d{4}: \d+/ }).last();
    await recorded.click();
    const panel = page.locator('section[aria-labelledby="cell-panel-title"]');
    await panel.getByRole('button', { name: 'Show the revision history' }).click();
    const history = panel.getByTestId('revision-history');
    await history.locator('tbody tr').first().waitFor();
    expect(await history.locator('tbody tr').first().innerText()).toMatch(/entered/);
    await w.shot('count-history');

    // The week's bulletin, before Monday's mail.
    await w.go('Bulletin');
    await page.locator('iframe[title]').waitFor();
    await w.shot('bulletin');

    await w.close();
    w.guard.assertClean();
  }, WALK_TIMEOUT);
});
