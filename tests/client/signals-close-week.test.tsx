import { QueryClientProvider } from '@tanstack/react-query';
import { describe, expect, it } from 'vitest';
import type { SignalsResponse } from '../../shared/api/cases.schema';
import { queryClient } from '../../src/app/query-client';
import { SignalsTable } from '../../src/features/cases/components/signals.table';
import { fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, render, typeInto, waitFor } from './support/render';

/** Issue 21 (epidemiologist): closing a week from the district's signals table asks first, and a closed week can be reopened with a reason. */
const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const stat = { statistic: null, alarm: null };
const week = (n: number, closed: boolean) => ({
  week: n, start: `2025-0${n < 5 ? 1 : 2}-0${(n % 4) + 1}`, countId: id(500 + n), cases: 3, late: false, closed, incidence: 1.2, channel: null, seasons: 0, zone: null,
  c1: stat, c2: stat, c3: stat, cusum: stat, growth: { ratio: null, percent: null, doublingWeeks: null },
});
const data = {
  district: { id: id(1), code: 'HV-01', name: 'Saltmarsh Coast' },
  disease: { id: id(50), code: 'dengue', name: 'Dengue', profileIds: [] },
  year: 2025, channelMethod: 'quartiles', epiWeekSystem: 'iso', priorSeasons: [], seasonsUsed: [], excludedYears: [], population: 80000,
  weeks: [week(2, true), week(3, false)], fittedGrowth: null, completeness: { expected: 2, received: 2, onTime: 2, share: 1 }, notes: [],
  canEnter: true, canReadHistory: false, canClose: true,
} as unknown as SignalsResponse;

async function renderTable() {
  const view = await render(
    <QueryClientProvider client={queryClient}>
      <SignalsTable data={data} today="2025-06-01" />
    </QueryClientProvider>,
  );
  return view.container;
}

const posts = (fetchMock: ReturnType<typeof fakeApi>, path: string) =>
  fetchMock.mock.calls.filter((c) => String(c[0]).endsWith(path) && (c[1] as RequestInit | undefined)?.method === 'POST');

describe('closing and reopening a week from the signals table', () => {
  it('when Close week is pressed, then nothing is sent until the closing is confirmed', async () => {
    const fetchMock = fakeApi({
      [`POST /api/districts/${id(1)}/weeks/close`]: () => json(200, { districtId: id(1), year: 2025, week: 3, closedAt: '2025-06-01T10:00:00Z', alreadyClosed: false }),
    });
    const c = await renderTable();
    await click(getButton(c, 'Close week'));
    expect(posts(fetchMock, '/weeks/close')).toHaveLength(0);
    expect(c.textContent).toContain('Close W3 2025 for Saltmarsh Coast? Its counts then change only through a correction with a reason');
    await click(getButton(c, 'Cancel'));
    expect(c.textContent).not.toContain('Yes, close the week');
    await click(getButton(c, 'Close week'));
    await click(getButton(c, 'Yes, close the week'));
    await waitFor(() => expect(posts(fetchMock, '/weeks/close')).toHaveLength(1));
    expect(JSON.parse((posts(fetchMock, '/weeks/close')[0][1] as RequestInit).body as string)).toEqual({ year: 2025, week: 3 });
  });

  it('when a closed week is reopened, then a reason is asked for and sent', async () => {
    const fetchMock = fakeApi({
      [`POST /api/districts/${id(1)}/weeks/reopen`]: () => json(200, { districtId: id(1), year: 2025, week: 2, reopened: true }),
    });
    const c = await renderTable();
    await click(getButton(c, 'Reopen'));
    await typeInto(getByLabel(c, 'Reason for reopening'), 'late report from a clinic');
    await click(getButton(c, 'Reopen the week'));
    await waitFor(() => expect(posts(fetchMock, '/weeks/reopen')).toHaveLength(1));
    expect(JSON.parse((posts(fetchMock, '/weeks/reopen')[0][1] as RequestInit).body as string)).toEqual({ year: 2025, week: 2, reason: 'late report from a clinic' });
    await waitFor(() => expect(c.textContent).toContain('W2 2025 is open again for Saltmarsh Coast.'));
  });
});
