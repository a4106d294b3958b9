import { describe, expect, it } from 'vitest';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { CaseEntryForm } from '../../src/features/cases/components/case-entry.form';
import type { CasesSettings } from '../../shared/api/cases.schema';
import { fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, render, typeInto, waitFor } from './support/render';

/**
 * Corrections keep every field (issue 16, item 6): the entry form loads the stored record, so correcting the
 * total of "47 (confirmed 19, probable 28)" to 49 keeps the split. The week is fixed (no real clock).
 */
const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const district = { id: id(1), code: 'HV-01', name: 'Saltmarsh Coast' };
const dengue = { id: id(2), code: 'DENV', name: 'Dengue', profileIds: [] };
const settings: CasesSettings = {
  epiWeekSystem: 'mmwr', channelMethod: 'geometric', cusum: { k: 0.5, h: 4 }, deadlineDays: 3, today: '2026-06-08',
  currentWeek: { year: 2026, week: 23, start: '2026-06-07', end: '2026-06-13' },
};
const stored = {
  id: id(3), districtId: district.id, diseaseId: dengue.id, year: 2026, week: 23, cases: 47, confirmed: 19, probable: 28,
  ageBands: { '15-44': 30 }, version: 1, late: false, reportedAt: '2026-06-08T08:00:00Z', updatedAt: '2026-06-08T08:00:00Z',
};

describe('the case entry form', () => {
  it('when the week already holds a count with its split, then the form shows every stored field and a corrected total keeps confirmed and probable', async () => {
    const sent: unknown[] = [];
    fakeApi({
      [`GET /api/districts/${district.id}/cases/count`]: () => json(200, { count: stored }),
      [`PUT /api/districts/${district.id}/cases`]: (init) => {
        const body = JSON.parse(String(init.body));
        sent.push(body);
        return json(200, { outcome: 'corrected', closed: false, count: { ...stored, ...body, version: 2 } });
      },
    });
    const { container: c } = await render(
      <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
        <CaseEntryForm districts={[district]} diseases={[dengue]} settings={settings} />
      </QueryClientProvider>,
    );
    await waitFor(() => expect(getByLabel(c, 'Cases').value).toBe('47'), 3000);
    expect(getByLabel(c, 'Confirmed (optional)').value).toBe('19');
    expect(getByLabel(c, 'Probable (optional)').value).toBe('28');
    expect(c.querySelector('[data-testid="stored-count"]')?.textContent).toContain('already holds 47 cases (confirmed 19, probable 28)');

    await typeInto(getByLabel(c, 'Cases'), '49');
    await typeInto(getByLabel(c, 'Reason (for a correction)'), 'Two late reports');
    await click(getButton(c, 'Save the count'));
    await waitFor(() => expect(sent).toHaveLength(1), 3000);
    expect(sent[0]).toMatchObject({ cases: 49, confirmed: 19, probable: 28, reason: 'Two late reports' });
    // The age bands the form does not show are not sent, so the server keeps them (absent = unchanged).
    expect(sent[0]).not.toHaveProperty('ageBands');
  });
});
