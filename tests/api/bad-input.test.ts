import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { ALL_TABLES, countRows, makeUser, signedInAgent } from '../support/factories';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
});
afterAll(() => t.close());

describe('bad input', () => {
  it('when the JSON is malformed, then the answer is 400 malformed_json and nothing is written', async () => {
    const before = await countRows(t.ds, ...ALL_TABLES);
    const res = await admin.post('/api/districts').set('Content-Type', 'application/json').send('{"code": "X1",');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
    expect(await countRows(t.ds, ...ALL_TABLES)).toEqual(before);
  });

  it('when a body is over the size limit, then the answer is 413', async () => {
    const res = await admin.post('/api/districts').send({ code: 'BIG-1', name: 'x'.repeat(1_100_000) });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('when a field has the wrong type or is unknown, then the answer names each field', async () => {
    const before = await countRows(t.ds, ...ALL_TABLES);
    const res = await admin.post('/api/districts').send({ code: 12, name: 'Ok', colour: 'red' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual(['code', 'colour']);
    expect(await countRows(t.ds, ...ALL_TABLES)).toEqual(before);
  });

  it('when a text holds a NUL character, which PostgreSQL text cannot store, then the answer is 400 naming the field and nothing is written', async () => {
    const before = await countRows(t.ds, ...ALL_TABLES);
    const res = await admin.post('/api/districts').send({ code: 'NUL-1', name: 'Bad\u0000name' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual([{ path: 'name', message: 'must not contain a NUL character' }]);
    const query = await admin.get('/api/weather/stations?x=%00');
    expect(query.status).toBeLessThan(500);
    expect(await countRows(t.ds, ...ALL_TABLES)).toEqual(before);
  });

  it('when the body is missing, then the answer is 400 naming the body', async () => {
    const res = await admin.post('/api/districts');
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('body');
  });

  it('when an API path does not exist, then the answer is a JSON 404', async () => {
    const res = await request(t.app).get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

describe('health', () => {
  it('when the database answers, then GET /api/health is 200 with database up', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'up' });
  });

  it('when the database is unreachable, then GET /api/health is 503 with database down', async () => {
    // A data source pointing at a closed port: every query fails as it would with the server stopped.
    const { createApp } = await import('../../server/app');
    const { createDataSource } = await import('../../server/db/data-source');
    const ds = createDataSource('postgres://nobody:x@127.0.0.1:9/none', 1);
    const app = createApp({ ...t.ctx, ds });
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(503);
    expect(res.body).toEqual({ status: 'degraded', database: 'down' });
  });
});
