import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeUser, signedInAgent } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('OpenAPI document', () => {
  it('when an admin asks for /api/openapi.json, then it is OpenAPI 3.1 and lists every route with its method, parameters, body and response', async () => {
    const admin = await makeUser(t.ds, { role: 'admin' });
    const agent = await signedInAgent(t.app, admin.email);
    const res = await agent.get('/api/openapi.json');
    expect(res.status).toBe(200);
    const doc = res.body;
    expect(doc.openapi).toBe('3.1.0');
    expect(doc.info.title).toBeTruthy();
    for (const route of t.app.locals.routes) {
      const path = '/api' + route.path.replace(/:([A-Za-z_]+)/g, '{$1}');
      const op = doc.paths[path]?.[route.method];
      expect(op, `${route.method} ${path}`).toBeDefined();
      expect(Array.isArray(op.parameters)).toBe(true);
      for (const name of [...route.path.matchAll(/:([A-Za-z_]+)/g)].map((m) => m[1])) {
        expect(op.parameters.some((p: { name: string; in: string }) => p.name === name && p.in === 'path'), `${path} ${name}`).toBe(true);
      }
      if (route.body) expect(op.requestBody.content['application/json'].schema, path).toBeDefined();
      if (route.response && typeof route.response === 'object') {
        const ok = op.responses[String(route.status ?? 200)];
        expect(ok.content['application/json'].schema, path).toBeDefined();
      }
    }
    // A described answer carries its fields (the sign-in answer is the signed-in user).
    expect(JSON.stringify(doc.paths['/api/me'].get.responses['200'])).toContain('"role"');
  });

  it('when a supervisor asks for it, then the answer is 403', async () => {
    const supervisor = await makeUser(t.ds, { role: 'supervisor' });
    const agent = await signedInAgent(t.app, supervisor.email);
    expect((await agent.get('/api/openapi.json')).status).toBe(403);
  });
});
