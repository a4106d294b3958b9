import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runSeasonNow, WARNINGS_KEPT } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeDistrict, makeUser, signedInAgent } from '../support/factories';

// Issue 21: a run keeps at most WARNINGS_KEPT (1,000) warnings; the rest are counted, not dropped
// silently. A small cap is injected so a handful of districts is enough to pass it.
let t: TestApp;
const AS_OF = '2026-08-20';

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
});
afterAll(() => t.close());

describe('season run warnings beyond the cap', () => {
  it('when a run raises more warnings than it keeps, then the API lists the cap (failed districts first) and says how many more were not listed', async () => {
    expect(WARNINGS_KEPT).toBe(1000);
    // Districts without a profile and without weather: each raises several warnings.
    const plain = [await makeDistrict(t.ds), await makeDistrict(t.ds), await makeDistrict(t.ds)];
    const broken = await makeDistrict(t.ds);
    const run = await runSeasonNow(t.ctx, {
      asOf: AS_OF, warningCap: 3,
      districtHook: (stage, id) => {
        if (stage === 'compute' && id === broken.id) throw new Error('bad data (test)');
      },
    });
    expect(run!.status).toBe('succeeded');
    const total = run!.warningsTotal;
    expect(total).toBeGreaterThan(3 + plain.length); // at least two warnings per plain district, and the failure

    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const res = await officer.get(`/api/season-runs/${run!.id}`);
    expect(res.status).toBe(200);
    expect(res.body.warnings).toHaveLength(3);
    expect(res.body.warnings[0]).toMatchObject({ code: 'district_failed', districtId: broken.id });
    expect(res.body.warningsNotListed).toBe(total - 3);
    expect(res.body.districtsFailed).toBe(1);
    const list = await officer.get('/api/season-runs');
    expect(list.body.runs.find((r: { id: string }) => r.id === run!.id).warningsNotListed).toBe(total - 3);
  });

  it('when a run raises fewer warnings than the cap, then all are listed and none is said to be missing', async () => {
    const run = await runSeasonNow(t.ctx, { asOf: AS_OF });
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const res = await officer.get(`/api/season-runs/${run!.id}`);
    expect(res.body.warnings.length).toBe(run!.warningsTotal);
    expect(res.body.warningsNotListed).toBe(0);
  });
});
