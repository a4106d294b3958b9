import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { FIELD_RECORDS_OUTBOX_KEY, FieldRecordOutbox } from '../../src/features/field-log/field-record-outbox';
import { OUTBOX_KEY } from '../../src/features/surveys/offline-queue';
import { json } from './support/fake-api';

const districtId = '33333333-3333-4333-8333-333333333333';
const id1 = '11111111-1111-4111-8111-111111111111';
const record = (id: string) => ({ id, districtId, locality: 'Harbour Row', date: '2026-03-10', kind: 'source-reduction' as const });
const stored = (id: string) => ({
  ...record(id),
  district: { id: districtId, code: 'HV-01', name: 'Saltmarsh Coast' },
  housesVisited: null, containers: null, areaM2: null, product: null, amount: null, amountUnit: null, notes: null,
  submittedBy: null, submittedAt: '2026-03-10T10:00:00.000Z',
});

beforeEach(() => localStorage.clear());
afterEach(() => vi.unstubAllGlobals());

describe('the field-record outbox (the surveys\u2019 queue, reused)', () => {
  it('when a record is saved offline, then it stays on the device under its own key and is sent once, with the same id, to the records route when the connection is back', async () => {
    let online = false;
    const posted: { url: string; id: string }[] = [];
    const fetchFn = vi.fn(async (url: unknown, init?: RequestInit) => {
      if (!online) throw new TypeError('Failed to fetch');
      const body = JSON.parse(String(init!.body));
      posted.push({ url: String(url), id: body.id });
      return json(posted.length === 1 ? 201 : 200, stored(body.id));
    });
    const outbox = new FieldRecordOutbox(localStorage, fetchFn as unknown as typeof fetch);
    outbox.add(record(id1));
    expect(await outbox.flush()).toEqual({ sent: [], kept: 1 });
    expect(localStorage.getItem(OUTBOX_KEY)).toBeNull();
    expect(JSON.parse(localStorage.getItem(FIELD_RECORDS_OUTBOX_KEY)!)[0]).toMatchObject({ survey: { id: id1 }, problem: { kind: 'offline' } });
    online = true;
    const reloaded = new FieldRecordOutbox(localStorage, fetchFn as unknown as typeof fetch);
    const [a, b] = await Promise.all([reloaded.flush(), reloaded.flush()]);
    expect(a).toBe(b);
    expect(a.sent.map((r) => r.id)).toEqual([id1]);
    expect(posted).toEqual([{ url: '/api/field-records', id: id1 }]);
    expect(reloaded.items()).toEqual([]);
  });
});
