import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { TIER_COLOURS, TIER_TEXT } from '../../src/features/ladder/tier-scale';
import { startDemoBrowser, type LiveServer } from '../support/demo-browser';

/*
 * Accessibility in a real browser (docs/accessibility.md): axe-core's WCAG 2.0, 2.1 and 2.2 level A and AA
 * rules on the screens people use most, in English and in French, plus keyboard checks on the Ladder.
 * axe is evaluated in the page through the DevTools protocol, so the app's Content-Security-Policy
 * (script-src 'self') stays on as in production. Selectors avoid English words where they can, so the
 * same steps work in every language.
 */

const AXE_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
const FAILING_IMPACTS = new Set(['serious', 'critical']);
const axeSource = readFileSync(path.join(path.dirname(createRequire(import.meta.url).resolve('axe-core')), 'axe.min.js'), 'utf8');

type AxeNode = { target: unknown[]; failureSummary?: string };
type AxeViolation = { id: string; impact: string | null; help: string; nodes: AxeNode[] };

let server: LiveServer;
let browser: Browser;
let stop: (() => Promise<void>) | undefined;

beforeAll(async () => {
  ({ server, browser, stop } = await startDemoBrowser());
});
afterAll(() => stop?.());

async function newPage(language: 'en' | 'fr'): Promise<{ page: Page; context: BrowserContext }> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, locale: language === 'fr' ? 'fr-FR' : 'en-GB' });
  // The interface language remembered on the device, read before the first paint.
  await context.addInitScript((lng) => {
    try {
      window.localStorage.setItem('broodcast.language', lng);
    } catch {
      // no storage: the browser's language (the context locale) applies
    }
  }, language);
  return { page: await context.newPage(), context };
}

/**
 * Signs in through the form, found by input types rather than by its (translated) labels, and sets the
 * account's language: after sign-in the account's language is the interface's, on every device.
 */
async function signIn(page: Page, email: string, language: 'en' | 'fr' = 'en') {
  await page.goto(server.baseUrl + '/sign-in');
  await page.locator('input[type="email"]').fill(email);
  await page.locator('input[type="password"]').fill(DEMO_PASSWORD);
  await page.locator('form button[type="submit"]').click();
  await page.getByTestId('current-role').waitFor();
  const status = await page.evaluate(
    (lng) =>
      fetch('/api/me/preferences', { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ language: lng }) }).then((r) => r.status),
    language,
  );
  expect(status, 'PATCH /api/me/preferences').toBeLessThan(300);
}

const describeViolation = (v: AxeViolation) =>
  `${v.id} (${v.impact}): ${v.help}\n${v.nodes
    .slice(0, 8)
    .map((n) => `    at ${n.target.map(String).join(' ')}${n.failureSummary ? `\n       ${n.failureSummary.replace(/\n/g, '\n       ')}` : ''}`)
    .join('\n')}${v.nodes.length > 8 ? `\n    … and ${v.nodes.length - 8} more` : ''}`;

/**
 * Runs axe on the whole document; returns the serious and critical violations as readable lines
 * (rule id, help, offending selectors) and prints the moderate and minor ones for the record.
 */
async function axeProblems(page: Page, screen: string): Promise<string[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(axeSource);
  const result = (await page.evaluate(
    (tags) =>
      (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<unknown> } }).axe.run(document, {
        runOnly: { type: 'tag', values: tags },
        resultTypes: ['violations'],
      }),
    AXE_TAGS,
  )) as { violations: AxeViolation[]; passes: unknown[]; incomplete: AxeViolation[] };
  // axe really ran its rules on this page (not an empty or broken document).
  expect(result.passes.length, `axe passes on ${screen}`).toBeGreaterThan(5);
  const minor = result.violations.filter((v) => !FAILING_IMPACTS.has(v.impact ?? ''));
  if (minor.length) console.info(`axe, ${screen}, moderate or minor:\n${minor.map(describeViolation).join('\n')}`);
  const unsure = result.incomplete.filter((v) => v.id === 'color-contrast');
  if (unsure.length) console.info(`axe, ${screen}: contrast it could not decide (checked by hand or by the tier check): ${unsure[0].nodes.length} elements`);
  return result.violations.filter((v) => FAILING_IMPACTS.has(v.impact ?? '')).map((v) => `${screen}: ${describeViolation(v)}`);
}

/** The Ladder with its rows and its drawn map. */
async function openLadder(page: Page) {
  await page.goto(server.baseUrl + '/');
  await page.locator('.ladder-table tbody tr[data-district]').first().waitFor();
  // On a phone the map's code loads only when the reader scrolls towards it (issue 20).
  await page.locator('[data-tour="region-map"]').scrollIntoViewIfNeeded();
  await page.locator('[data-testid="region-map"] canvas').first().waitFor();
  await page.evaluate(() => window.scrollTo(0, 0));
}

/** The District file of the district the Ladder ranks first (the highest tier), with its charts drawn. */
async function openTopDistrictFile(page: Page) {
  await openLadder(page);
  const href = await page.locator('.ladder-table tbody tr[data-district]').first().locator('th a').getAttribute('href');
  expect(href).toMatch(/^\/districts\/[0-9a-f-]{36}$/);
  await page.goto(server.baseUrl + href);
  await page.locator('figure[data-chart] [data-testid="chart-box"] canvas').first().waitFor();
  await page.waitForFunction(() =>
    [...document.querySelectorAll('figure[data-chart] [data-testid="chart-box"]')].every((b) => b.querySelector('canvas, svg')),
  );
}

/**
 * Every tier mark on the page carries its word, and that word reads on its fill at 4.5:1 or more — also on
 * the lighter or darker stripes of an unsure tier's hatch, which axe leaves undecided. A bare colour chip
 * is hidden from assistive technology and sits beside a word.
 */
async function tierProblems(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const bad: string[] = [];
    const rgba = (css: string) => {
      const m = /rgba?\(([^)]+)\)/.exec(css);
      const [r, g, b, a = 1] = (m ? m[1] : '0,0,0,0').split(/[ ,/]+/).filter(Boolean).map(Number);
      return { r, g, b, a };
    };
    const over = (top: { r: number; g: number; b: number; a: number }, under: { r: number; g: number; b: number }) => ({
      r: top.r * top.a + under.r * (1 - top.a),
      g: top.g * top.a + under.g * (1 - top.a),
      b: top.b * top.a + under.b * (1 - top.a),
    });
    const lum = ({ r, g, b }: { r: number; g: number; b: number }) => {
      const [R, G, B] = [r, g, b].map((v) => {
        const c = v / 255;
        return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
      });
      return 0.2126 * R + 0.7152 * G + 0.0722 * B;
    };
    const ratio = (x: { r: number; g: number; b: number }, y: { r: number; g: number; b: number }) => {
      const [hi, lo] = [lum(x), lum(y)].sort((p, q) => q - p);
      return (hi + 0.05) / (lo + 0.05);
    };
    for (const badge of document.querySelectorAll<HTMLElement>('.tier-badge')) {
      const word = badge.textContent?.trim();
      if (!word && !badge.getAttribute('aria-label')) {
        bad.push(`a ${badge.dataset.tier ?? ''} tier badge has no word`);
        continue;
      }
      const cs = getComputedStyle(badge);
      const fill = rgba(cs.backgroundColor);
      if (fill.a < 1) continue; // no fill of its own: axe's colour rule covers it
      const layers = [fill, ...(cs.backgroundImage.match(/rgba?\([^)]+\)/g) ?? []).map((c) => over(rgba(c), fill))];
      const text = rgba(cs.color);
      const worst = Math.min(...layers.map((l) => ratio(text, l)));
      if (worst < 4.5) bad.push(`tier badge "${word}"${badge.classList.contains('is-unsure') ? ' (unsure)' : ''}: text contrast ${worst.toFixed(2)}:1 on its fill`);
    }
    for (const swatch of document.querySelectorAll<HTMLElement>('.tier-swatch')) {
      if (swatch.getAttribute('aria-hidden') !== 'true') bad.push('a tier swatch is not aria-hidden');
      const holder = swatch.closest('a, li, td, th, dd, p') ?? swatch.parentElement;
      if (!holder?.textContent?.trim()) bad.push(`a tier swatch stands alone in ${holder?.tagName.toLowerCase()}`);
    }
    return [...new Set(bad)];
  });
}

type Stop = { where: 'filter' | 'row-link' | 'map-link' | 'other'; label: string; ring: boolean; hidden: boolean; lastOnMap: boolean };

/** Where focus is now: what it is, whether it shows a ring, and whether something hides it entirely (WCAG 2.4.11). */
const focusStop = (page: Page) =>
  page.evaluate((): Stop | null => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return null;
    const cs = getComputedStyle(el);
    const outline = cs.outlineStyle !== 'none' && parseFloat(cs.outlineWidth) > 0;
    const shadow = cs.boxShadow !== 'none' && cs.boxShadow !== '';
    // Hidden means no part shows (WCAG 2.4.11 at AA): none of five points inside it (middle, corners inset) hits it.
    const r = el.getBoundingClientRect();
    const inset = Math.min(3, r.width / 4, r.height / 4);
    const points = [
      [r.left + r.width / 2, r.top + r.height / 2],
      [r.left + inset, r.top + inset],
      [r.right - inset, r.top + inset],
      [r.left + inset, r.bottom - inset],
      [r.right - inset, r.bottom - inset],
    ];
    const hits = points.map(([x, y]) => document.elementFromPoint(x, y));
    const hit = hits.find((h) => h && (h === el || el.contains(h))) ?? hits[0];
    const where = el.matches('input[type="search"], input[type="text"]') && el.closest('main')
      ? 'filter'
      : el.matches('.ladder-table tbody a')
        ? 'row-link'
        : el.matches('.map-district-list a')
          ? 'map-link'
          : 'other';
    const label = `${el.tagName.toLowerCase()} "${(el.textContent || el.getAttribute('aria-label') || '').trim().slice(0, 40)}"`;
    const mapLinks = document.querySelectorAll('.map-district-list a');
    const lastOnMap = mapLinks.length > 0 && el === mapLinks[mapLinks.length - 1];
    const hidden = !hit || !(hit === el || el.contains(hit));
    const at = hidden ? ` at ${Math.round(r.left)},${Math.round(r.top)} ${Math.round(r.width)}×${Math.round(r.height)}, under ${hit ? `${hit.tagName.toLowerCase()}.${hit.className}` : 'nothing (off screen)'}` : '';
    return { where, label: label + at, ring: outline || shadow, hidden, lastOnMap };
  });

/** Presses the key until `done` holds for the focused element (or focus leaves the page); records each stop. */
async function tabUntil(page: Page, key: 'Tab' | 'Shift+Tab', done: (s: Stop) => boolean): Promise<Stop[]> {
  const stops: Stop[] = [];
  for (let i = 0; i < 150; i++) {
    await page.keyboard.press(key);
    const stop = await focusStop(page);
    if (!stop) break;
    stops.push(stop);
    if (done(stop)) break;
  }
  return stops;
}

describe.each(['en', 'fr'] as const)('accessibility of the main screens (%s)', (language) => {
  const problems: string[] = [];
  const languageCheck = async (page: Page, screen: string) => {
    const lang = await page.evaluate(() => document.documentElement.lang);
    if (!lang.startsWith(language)) problems.push(`${screen}: <html lang="${lang}"> but the interface was asked for in ${language}`);
  };

  it('when the sign-in page is checked with axe, then it has no serious or critical violation', async () => {
    const { page, context } = await newPage(language);
    await page.goto(server.baseUrl + '/sign-in');
    await page.locator('form button[type="submit"]').waitFor();
    await languageCheck(page, 'sign-in');
    expect([...problems.splice(0), ...(await axeProblems(page, `sign-in (${language})`))]).toEqual([]);
    await context.close();
  });

  it('when the officer’s Ladder and a District file are checked with axe, then they have no serious or critical violation and every tier carries its word', async () => {
    const { page, context } = await newPage(language);
    await signIn(page, 'officer@halvern.example', language);
    await openLadder(page);
    await languageCheck(page, 'Ladder');
    problems.push(...(await axeProblems(page, `Ladder (${language})`)));
    expect(await page.locator('.ladder-table .tier-badge').count()).toBe(12);
    // The demo may have no unsure tier: the unsure look of every tier is drawn beside the table and checked too.
    await page.evaluate(
      ({ fills, words }) => {
        const model = document.querySelector('.ladder-table .tier-badge')!;
        const row = document.createElement('p');
        row.id = 'unsure-tiers';
        for (const [tier, fill] of Object.entries(fills)) {
          const badge = model.cloneNode(true) as HTMLElement;
          badge.classList.add('is-unsure');
          badge.dataset.tier = tier;
          badge.style.backgroundColor = fill;
          badge.style.color = words[tier];
          badge.textContent = tier;
          row.appendChild(badge);
        }
        document.querySelector('main')!.appendChild(row);
      },
      { fills: TIER_COLOURS as Record<string, string>, words: TIER_TEXT as Record<string, string> },
    );
    problems.push(...(await tierProblems(page)).map((p) => `Ladder: ${p}`));
    await page.evaluate(() => document.getElementById('unsure-tiers')?.remove());

    await openTopDistrictFile(page);
    await languageCheck(page, 'District file');
    problems.push(...(await axeProblems(page, `District file (${language})`)));
    problems.push(...(await tierProblems(page)).map((p) => `District file: ${p}`));
    expect(problems.splice(0)).toEqual([]);
    await context.close();
  });

  it('when the epidemiologist’s Case ledger with its entry form is checked with axe, then it has no serious or critical violation', async () => {
    const { page, context } = await newPage(language);
    await signIn(page, 'epi@halvern.example', language);
    await page.goto(server.baseUrl + '/cases');
    await page.locator('main form select').first().waitFor();
    await page.locator('main table tbody tr').first().waitFor();
    await languageCheck(page, 'Case ledger');
    expect([...problems.splice(0), ...(await axeProblems(page, `Case ledger (${language})`))]).toEqual([]);
    await context.close();
  });

  it('when the supervisor’s sign-off queue is checked with axe, then it has no serious or critical violation', async () => {
    const { page, context } = await newPage(language);
    await signIn(page, 'supervisor@halvern.example', language);
    await page.goto(server.baseUrl + '/sign-off');
    await page.locator('main ol > li form').first().waitFor();
    await languageCheck(page, 'Sign-off');
    expect([...problems.splice(0), ...(await axeProblems(page, `Sign-off (${language})`))]).toEqual([]);
    await context.close();
  });
});

describe('more screens with sideways-scrolling tables', () => {
  it('when the officer’s Surveys screen and a district’s cases page are checked with axe, then a table that scrolls sideways can be scrolled by keyboard and nothing serious is found', async () => {
    const { page, context } = await newPage('en');
    await signIn(page, 'officer@halvern.example');
    await page.goto(server.baseUrl + '/surveys');
    await page.locator('main h1').waitFor();
    await page.locator('main table tbody tr').first().waitFor();
    const problems = await axeProblems(page, 'Surveys');
    await openLadder(page);
    const href = await page.locator('.ladder-table tbody tr[data-district] th a').first().getAttribute('href');
    await page.goto(`${server.baseUrl}${href}/cases`);
    await page.locator('[data-testid="signals-table"] tbody tr').first().waitFor();
    problems.push(...(await axeProblems(page, 'District cases')));
    expect(problems).toEqual([]);
    await context.close();
  });
});

describe('the Ladder on a phone', () => {
  it('when the Ladder is checked at 360 px wide, then axe finds no serious or critical violation and the page itself never scrolls sideways (WCAG 1.4.10)', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, locale: 'en-GB' });
    const page = await context.newPage();
    await signIn(page, 'officer@halvern.example');
    await openLadder(page);
    const problems = await axeProblems(page, 'Ladder on a phone');
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    if (overflow > 1) problems.push(`the page is ${overflow} px wider than the screen`);
    expect(problems).toEqual([]);
    await context.close();
  });
});

describe('the axe harness', () => {
  it('when a page holds a known fault (an image without a text alternative), then the check reports it with its selector', async () => {
    const { page, context } = await newPage('en');
    await page.goto(server.baseUrl + '/sign-in');
    await page.locator('form button[type="submit"]').waitFor();
    await page.evaluate(() => {
      const img = document.createElement('img');
      img.src = 'data:image/gif;base64,R0lGODlhAQABAAAAACw=';
      img.id = 'planted-fault';
      document.querySelector('main, #root')!.appendChild(img);
    });
    const found = await axeProblems(page, 'planted fault');
    expect(found.join('\n')).toMatch(/image-alt \(critical\)[\s\S]*#planted-fault/);
    await context.close();
  });
});

describe('the Ladder by keyboard', () => {
  it('when a person tabs through the Ladder and back, then focus reaches the filter, every row’s link and the map’s district list, always with a visible ring and never hidden', async () => {
    const { page, context } = await newPage('en');
    await signIn(page, 'officer@halvern.example');
    await openLadder(page);
    const stops = await tabUntil(page, 'Tab', (s) => s.lastOnMap);
    const kinds = stops.map((s) => s.where);
    expect(kinds).toContain('filter');
    expect(kinds.filter((k) => k === 'row-link').length).toBe(12);
    expect(kinds.filter((k) => k === 'map-link').length).toBe(12);
    // In reading order: the filter, then the table, then the map beside it.
    expect(kinds.indexOf('filter')).toBeLessThan(kinds.indexOf('row-link'));
    expect(kinds.lastIndexOf('row-link')).toBeLessThan(kinds.indexOf('map-link'));
    // And back up again (where a sticky table header could cover the row it scrolls to).
    const back = await tabUntil(page, 'Shift+Tab', (s) => s.where === 'filter');
    expect(back.at(-1)?.where).toBe('filter');
    const all = [...stops, ...back];
    expect(all.filter((s) => !s.ring).map((s) => `no focus ring: ${s.label}`)).toEqual([]);
    expect(all.filter((s) => s.hidden).map((s) => `covered or off screen when focused: ${s.label}`)).toEqual([]);
    await tabUntil(page, 'Tab', (s) => s.lastOnMap);

    // The map's keyboard path opens a District file.
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/districts\/[0-9a-f-]{36}$/);
    await page.locator('h1').waitFor();
    await context.close();
  });

  it('when the skip link is used, then focus moves past the navigation into the main content', async () => {
    const { page, context } = await newPage('en');
    await signIn(page, 'officer@halvern.example');
    await openLadder(page);
    await page.keyboard.press('Tab');
    const first = await page.evaluate(() => ({ href: document.activeElement?.getAttribute('href'), top: document.activeElement?.getBoundingClientRect().top ?? -1 }));
    expect(first.href).toBe('#main');
    expect(first.top).toBeGreaterThanOrEqual(0); // shown on focus, not left off screen
    await page.keyboard.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('main');
    await context.close();
  });
});
