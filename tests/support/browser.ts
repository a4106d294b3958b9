import { chromium, type Browser } from 'playwright-core';

/**
 * Debian's Chromium driven by playwright-core (never a downloaded browser). The networking flags
 * keep it from calling out of this closed machine; playwright gives each launch a fresh, empty profile.
 */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update',
      '--disable-sync', '--no-first-run', '--disable-quic',
    ],
  });
}
