import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeUser, signedInAgent } from '../support/factories';
import { makeSeasonDistrict } from '../support/season-factories';
import { runSeasonNow } from '../../server/season/season-run.service';

// Issue 21: the Ladder's cached board must follow a rename or a new profile assignment at once, not wait
// for the next season run.
let t: TestApp;
let district: { id: string; name: string };

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  district = await makeSeasonDistrict(t.ds);
  await runSeasonNow(t.ctx, { asOf: '2026-08-20' });
});
afterAll(() => t.close());

describe('the board cache', () => {
  it('when a district is renamed through the districts route, then the board answers a new ETag and the new name', async () => {
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const first = await admin.get('/api/board');
    expect(first.status).toBe(200);
    const etag = first.headers.etag;
    expect(first.body.rows.find((r: { districtId: string }) => r.districtId === district.id).name).toBe(district.name);
    expect((await admin.get('/api/board').set('If-None-Match', etag)).status).toBe(304);

    const renamed = await admin.patch(`/api/districts/${district.id}`).send({ name: 'Korrin Bay North' });
    expect(renamed.status).toBe(200);
    const second = await admin.get('/api/board').set('If-None-Match', etag);
    expect(second.status).toBe(200);
    expect(second.headers.etag).not.toBe(etag);
    expect(second.body.rows.find((r: { districtId: string }) => r.districtId === district.id).name).toBe('Korrin Bay North');
  });

  it('when a district’s profile assignment changes, then the board answers a new ETag', async () => {
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const etag = (await admin.get('/api/board')).headers.etag;
    const res = await admin.put('/api/districts/profiles').send({ districtIds: [district.id], profiles: [{ profileId: 'culex-wnv', biofix: null }], reason: 'wrong vector' });
    expect(res.status).toBe(200);
    const after = await admin.get('/api/board').set('If-None-Match', etag);
    expect(after.status).toBe(200);
    expect(after.headers.etag).not.toBe(etag);
    // Nothing else changed: the new ETag holds.
    expect((await admin.get('/api/board').set('If-None-Match', after.headers.etag)).status).toBe(304);
  });
});
