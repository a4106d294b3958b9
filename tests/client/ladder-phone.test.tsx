import { describe, expect, it, vi } from 'vitest';
import { MemoryRouter } from 'react-router-dom';
import { boardResponse } from '../../shared/api/board.schema';
import { LadderTable } from '../../src/features/ladder/components/ladder.table';
import { demoBoard } from './support/board-fixtures';
import { click, render } from './support/render';

/** Issue 21: the Ladder at 360 px opens with the columns that fit; the others are one tap away. */
const rows = boardResponse.parse(demoBoard).rows;
const headers = (c: HTMLElement) => [...c.querySelectorAll('thead th')].map((th) => th.querySelector('button')?.textContent?.replace(/[▲▼↕\s]+$/u, '').trim());

function screenWidth(narrow: boolean) {
  vi.spyOn(window, 'matchMedia').mockImplementation((query: string) => ({
    matches: narrow && query.includes('max-width'), media: query, onchange: null,
    addListener: () => {}, removeListener: () => {}, addEventListener: () => {}, removeEventListener: () => {}, dispatchEvent: () => false,
  }) as MediaQueryList);
}

async function renderTable() {
  const view = await render(
    <MemoryRouter>
      <LadderTable rows={rows} caption="The Ladder" />
    </MemoryRouter>,
  );
  return view.container;
}

describe('the Ladder on a phone', () => {
  it('when the screen is a phone, then rank, district, tier and the change since last week show, and the other columns can be turned on', async () => {
    screenWidth(true);
    const c = await renderTable();
    expect(headers(c)).toHaveLength(4);
    expect(headers(c)[3]).toMatch(/^Since last week/);
    const chooser = c.querySelector('.column-chooser')!;
    const cases = [...chooser.querySelectorAll('label')].find((l) => l.textContent === 'Cases (last complete week)')!.querySelector('input')!;
    expect(cases.checked).toBe(false);
    await click(cases);
    expect(headers(c)).toHaveLength(5);
    vi.restoreAllMocks();
  });

  it('when the screen is wide, then every column shows', async () => {
    screenWidth(false);
    const c = await renderTable();
    expect(headers(c).length).toBeGreaterThanOrEqual(8);
    vi.restoreAllMocks();
  });
});
