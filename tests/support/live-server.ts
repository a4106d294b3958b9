import type { AddressInfo } from 'node:net';
import { createTestApp, type TestApp } from './test-app';

/** The real app listening on a free loopback port, serving the built client (dist/client). */
export async function startLiveServer(overrides: Record<string, string> = {}) {
  const t: TestApp = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', ...overrides });
  const server = t.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    ...t,
    baseUrl,
    async stop() {
      await new Promise((r) => server.close(r));
      await t.close();
    },
  };
}
