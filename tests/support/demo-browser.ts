import type { Browser } from 'playwright-core';
import { seedDemoIfEmpty } from '../../sample/seed-demo';
import { runSeasonNow, startupRuns } from '../../server/season/season-run.service';
import { launchBrowser } from './browser';
import { startLiveServer } from './live-server';

export type LiveServer = Awaited<ReturnType<typeof startLiveServer>>;

/**
 * A live server on this file's own database with the demo region seeded and tiers computed, and
 * Chromium: what the browser tests of the main screens start from. `runs: 'startup'` computes the
 * last eight weeks first, as `npm start` does on a fresh installation (a tier history, "since last week").
 */
export async function startDemoBrowser(opts: { runs?: 'season' | 'startup' } = {}): Promise<{ server: LiveServer; browser: Browser; stop: () => Promise<void> }> {
  const server = await startLiveServer();
  await seedDemoIfEmpty(server.ds, { nodeEnv: 'test', bcryptCost: 4 });
  if (opts.runs === 'startup') await startupRuns(server.ctx);
  else await runSeasonNow(server.ctx);
  const browser = await launchBrowser();
  return {
    server,
    browser,
    stop: async () => {
      await browser.close();
      await server.stop();
    },
  };
}
