

import { describe, expect, it, vi } from 'vitest';
import { demoBoundaries } from './support/board-fixtures';
import { fakeApi, json, officerMe } from './support/fake-api';
import { waitFor, type Rendered, renderRoutes } from './support/render';

vi.mock('../../src/components/chart/echart', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echart-base', () => import('./support/echart-stub'));
vi.mock('../../src/components/chart/echarts-core', () => ({ echarts: { registerMap: vi.fn() } }));

/**
 * The database-down drill (bench/drills/database-down.drill.ts) sees the API answer 503
 * `database_unavailable` while PostgreSQL is stopped; here the client shows that answer's message.
 */
const DOWN = { error: { code: 'database_unavailable', message: 'The database is not answering. Try again in a minute.' } };

let view: Rendered | undefined;
async function open(path: string) {
  const opened = await renderRoutes(path);
  view = opened;
  const router = opened.router;
  return view.container;
}

describe('when the database is down', () => {
  it('when the Ladder’s data answers 503 database_unavailable, then the screen shows the server’s message and keeps the navigation', async () => {
    fakeApi({
      'GET /api/me': () => json(200, officerMe),
      'GET /api/board': () => json(503, DOWN),
      'GET /api/districts/boundaries': () => json(503, DOWN),
    });
    const c = await open('/');
    // Queries retry a 5xx twice before showing it.
    await waitFor(() => expect(c.textContent).toContain('The database is not answering. Try again in a minute.'), 10_000);
    expect(c.querySelector('nav[aria-label="Main"]')).not.toBeNull();
  }, 15_000);

  it('when the signed-in user cannot be read (503), then the page says the database is not answering rather than asking to sign in', async () => {
    fakeApi({ 'GET /api/me': () => json(503, DOWN), 'GET /api/board': () => json(503, DOWN), 'GET /api/districts/boundaries': () => json(200, demoBoundaries) });
    const c = await open('/');
    await waitFor(() => expect(c.textContent).toContain('The database is not answering. Try again in a minute.'), 10_000);
  }, 15_000);
});
