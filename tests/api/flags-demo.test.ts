import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { seedDemoIfEmpty } from '../../sample/seed-demo';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { signedInAgent } from '../support/factories';
import { caughtFor, waitForMails } from '../support/flags-factories';

let t: TestApp;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  await seedDemoIfEmpty(t.ds, { nodeEnv: 'test', bcryptCost: 4 });
  await runSeasonNow(t.ctx);
});
afterAll(() => t.close());

describe('the demo, end to end', () => {
  it('when the demo supervisor approves a Saltmere flag raised by the season run, then the demo community worker gets the advisory by mail', async () => {
    const supervisor = await signedInAgent(t.app, 'supervisor@halvern.example', DEMO_PASSWORD);
    const queue = await supervisor.get('/api/flags');
    const flag = queue.body.flags.find((f: { districtName: string; source: string }) => f.districtName === 'Saltmere' && f.source === 'season-run');
    expect(flag).toBeTruthy();
    const before = (await caughtFor(['worker@halvern.example'])).length;
    const res = await supervisor.post(`/api/flags/${flag.id}/approve`).send({ version: flag.version });
    expect(res.status).toBe(200);
    await new OutboxWorker(t.ctx).drain();
    const mails = await waitForMails(['worker@halvern.example'], before + 1);
    const advisory = mails.slice(before).find((m) => m.subject.startsWith('Broodcast advisory: Saltmere'));
    expect(advisory).toBeTruthy();
    expect(advisory!.text).toContain('national health authority');
  });
});
