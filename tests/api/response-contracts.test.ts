import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * Every route declares the contract of its answer (`response` in server/http/route.ts): a shared zod
 * schema, 'empty' (204 only) or 'stream' (CSV, PDF, HTML, cached gzip). In tests mountRoutes checks every
 * JSON answer against it, so every API test checks every answer.
 */
// Routes still without a response schema when the check was introduced; the list may only shrink.
const NOT_YET_DECLARED = ['POST /weather/observations/void', 'PUT /districts/:id/channel-settings'];

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('response contracts', () => {
  it('when the app is built, then every route declares its response (a schema, empty or stream)', () => {
    const missing = t.app.locals.routes.filter((r) => r.response === undefined).map((r) => `${r.method.toUpperCase()} ${r.path}`);
    expect(missing.sort()).toEqual([...NOT_YET_DECLARED].sort());
  });

  it('when an answer does not match its contract, then the API answers 500 response_contract_violation', async () => {
    const health = t.app.locals.routes.find((r) => r.path === '/health')!;
    const before = health.response;
    const { z } = await import('zod');
    health.response = z.object({ status: z.literal('never') });
    try {
      const res = await request(t.app).get('/api/health');
      expect(res.status).toBe(500);
      expect(res.body.error.code).toBe('response_contract_violation');
    } finally {
      health.response = before;
    }
    expect((await request(t.app).get('/api/health')).status).toBe(200);
  });
});
