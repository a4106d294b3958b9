/**
 * Redraws the app's PNG icons (public/icon-*.png) from the hand-written SVGs in public/, with Debian's
 * Chromium through playwright-core (nothing downloaded). Run after changing an SVG:
 *   npx tsx scripts/draw-icons.ts
 * The PNGs are committed; the build only copies them. Not part of the client bundle.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { launchBrowser } from '../tests/support/browser';

const PUBLIC = path.resolve('public');
const ICONS = [
  { svg: 'icon.svg', png: 'icon-192.png', size: 192 },
  { svg: 'icon.svg', png: 'icon-512.png', size: 512 },
  { svg: 'icon-maskable.svg', png: 'icon-maskable-512.png', size: 512 },
  { svg: 'icon.svg', png: 'apple-touch-icon.png', size: 180 },
];

const browser = await launchBrowser();
try {
  for (const icon of ICONS) {
    const page = await browser.newPage({ viewport: { width: icon.size, height: icon.size }, deviceScaleFactor: 1 });
    const svg = readFileSync(path.join(PUBLIC, icon.svg), 'utf8').replace(/width="512" height="512"/, `width="${icon.size}" height="${icon.size}"`);
    await page.setContent(`<!doctype html><html><body style="margin:0;background:transparent">${svg}</body></html>`);
    const png = await page.locator('svg').screenshot({ omitBackground: true, type: 'png' });
    writeFileSync(path.join(PUBLIC, icon.png), png);
    await page.close();
    console.log(`${icon.png} (${icon.size} px, ${png.length} bytes)`);
  }
} finally {
  await browser.close();
}
