import { afterEach, describe, expect, it } from 'vitest';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { IssueDto, UploadDto } from '../../shared/api/weather.schema';
import { i18n } from '../../src/i18n';
import { UploadResult } from '../../src/features/weather/components/upload-result';
import { fakeApi, json } from './support/fake-api';
import { click, getButton, getByLabel, render, typeInto, waitFor } from './support/render';

/**
 * Issue 16 item 1 and issue 21: a held row in the report offers Correct, pre-filled with every value of the
 * row as stored (station, date, Tmin, Tmax, RH, rain), and Confirm with a reason.
 */
const upload: UploadDto = {
  id: '00000000-0000-4000-8000-000000001601', source: 'upload', fileName: 'december.csv', status: 'done', tempUnit: 'C', rainUnit: 'mm',
  bytesTotal: 100, bytesProcessed: 100, rowsProcessed: 1, rowsAccepted: 1, rowsFlagged: 0, rowsRejected: 0, rowsReplaced: 0, rowsHeld: 1,
  rowsConflicting: 0, issueCount: 1, message: null, reasonCode: null, reasonParams: null,
  createdAt: '2026-12-05T10:00:00.000Z', finishedAt: '2026-12-05T10:00:01.000Z',
};
const held: IssueDto = {
  rowNumber: 2, station: 'HV-UP-07', date: '2026-12-02', column: 'tmax', value: '59', severity: 'held', rule: 'looks_fahrenheit',
  reason: 'Held: …', params: { column: 'tmax', value: 59, median: 6.1, mad: 1.4, z: 25.5, n: 93, basis: 'station', alternative: 15 },
  stored: { tmin: 50.2, tmax: 59, rh: 61, rain: 3.4, held: true },
};

afterEach(async () => {
  await i18n.changeLanguage('en');
});

describe('a held row in the Intake report', () => {
  it('when Correct is pressed on a held row, then the form is pre-filled with every value of the row and the saved correction keeps RH and rain', async () => {
    let sent: Record<string, unknown> | null = null;
    fakeApi({
      [`GET /api/weather/uploads/${upload.id}`]: () => json(200, upload),
      [`GET /api/weather/uploads/${upload.id}/issues`]: () => json(200, { total: 1, issues: [held] }),
      'PUT /api/weather/observations': (init) => {
        sent = JSON.parse(String(init.body));
        return json(200, { ...upload, id: '00000000-0000-4000-8000-000000001602', source: 'correction', rowsHeld: 0, rowsReplaced: 1 });
      },
    });
    const view = await render(
      <QueryClientProvider client={new QueryClient()}>
        <UploadResult initial={upload} />
      </QueryClientProvider>,
    );
    await waitFor(() => {
      expect(view.container.textContent).toContain('Held (not used yet)');
      expect(view.container.textContent).toContain('Read as °F it would be 15 °C, which fits');
    });
    await click(getButton(view.container, 'Correct'));
    const field = (label: string) => getByLabel(view.container, label).value;
    await waitFor(() => expect(field('Station code')).toBe('HV-UP-07'));
    expect(field('Date')).toBe('2026-12-02');
    expect(field('Tmin (°C)')).toBe('50.2');
    expect(field('Tmax (°C)')).toBe('59');
    expect(field('RH (%)')).toBe('61');
    expect(field('Rain (mm)')).toBe('3.4');

    await typeInto(getByLabel(view.container, 'Tmin (°C)'), '10.1');
    await typeInto(getByLabel(view.container, 'Tmax (°C)'), '15');
    await click(getButton(view.container, 'Save the correction'));
    await waitFor(() => expect(sent).not.toBeNull());
    expect(sent).toMatchObject({ station: 'HV-UP-07', date: '2026-12-02', tmin: 10.1, tmax: 15, rh: 61, rain: 3.4 });
  });

  it('when Confirm is pressed on a held row, then a reason is asked for and the day is confirmed with it', async () => {
    let sent: Record<string, unknown> | null = null;
    fakeApi({
      [`GET /api/weather/uploads/${upload.id}`]: () => json(200, upload),
      [`GET /api/weather/uploads/${upload.id}/issues`]: () => json(200, { total: 1, issues: [held] }),
      'POST /api/weather/observations/confirm': (init) => {
        sent = JSON.parse(String(init.body));
        return json(200, { stationId: '00000000-0000-4000-8000-000000001603', date: '2026-12-02', districtsRecomputed: 1 });
      },
    });
    const view = await render(
      <QueryClientProvider client={new QueryClient()}>
        <UploadResult initial={upload} />
      </QueryClientProvider>,
    );
    await waitFor(() => getButton(view.container, 'Confirm'));
    await click(getButton(view.container, 'Confirm'));
    await click(getButton(view.container, 'Confirm'));
    await waitFor(() => expect(view.container.textContent).toContain('A reason is required.'));
    expect(sent).toBeNull();
    await typeInto(getByLabel(view.container, 'Reason (kept in the audit trail)'), 'Checked with the observer');
    await click(getButton(view.container, 'Confirm'));
    await waitFor(() => expect(sent).toEqual({ station: 'HV-UP-07', date: '2026-12-02', reason: 'Checked with the observer' }));
  });

  it('when a held day has since been corrected or confirmed, then the report says it is in use and offers no Confirm', async () => {
    // Found walking the product: after a correction the report still said "Held (not used yet)".
    fakeApi({
      [`GET /api/weather/uploads/${upload.id}`]: () => json(200, upload),
      [`GET /api/weather/uploads/${upload.id}/issues`]: () => json(200, { total: 1, issues: [{ ...held, stored: { ...held.stored!, tmin: 10.1, tmax: 15, held: false } }] }),
    });
    const view = await render(
      <QueryClientProvider client={new QueryClient()}>
        <UploadResult initial={upload} />
      </QueryClientProvider>,
    );
    await waitFor(() => expect(view.container.textContent).toContain('Held at upload; confirmed or corrected since (in use)'));
    expect(view.container.textContent).not.toContain('Held (not used yet)');
    expect([...view.container.querySelectorAll('button')].some((b) => b.textContent === 'Confirm')).toBe(false);
    view.unmount();
  });
});
