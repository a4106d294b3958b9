import { useEffect, useState } from 'react';
import type { SubscriptionDto } from '../../../shared/api/bulletins.schema';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useSaveSubscriptions, useSubscriptions } from './api/subscriptions.api';

type Choice = Pick<SubscriptionDto, 'districtId' | 'advisory' | 'bulletin'>;

/** Which districts' advisories and weekly bulletins come to me by mail (every signed-in role). */
export function PreferencesPage() {
  const subs = useSubscriptions();
  const save = useSaveSubscriptions();
  const [choice, setChoice] = useState<Choice[]>([]);
  useEffect(() => {
    if (subs.data) setChoice(subs.data.districts.map(({ districtId, advisory, bulletin }) => ({ districtId, advisory, bulletin })));
  }, [subs.data]);
  const set = (districtId: string, key: 'advisory' | 'bulletin', value: boolean) =>
    setChoice((c) => c.map((x) => (x.districtId === districtId ? { ...x, [key]: value } : x)));
  const setAll = (value: boolean) => setChoice((c) => c.map((x) => ({ ...x, advisory: value, bulletin: value })));

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="Advisories come as soon as a supervisor approves them; the bulletin comes once a week. Until you save a choice here, you receive what your role receives by default.">
        Mail preferences
      </PageHeading>
      {subs.isPending ? (
        <p className="text-ink-muted">Loading your preferences…</p>
      ) : subs.isError ? (
        <FormMessage kind="error">{subs.error.message}</FormMessage>
      ) : (
        <form
          className="card space-y-4"
          onSubmit={(e) => {
            e.preventDefault();
            save.mutate({ districts: choice });
          }}
        >
          <p className="text-sm">
            Mail goes to <strong>{subs.data.email}</strong>.{' '}
            {subs.data.source === 'default' ? 'You have not chosen yet: these are your role’s defaults.' : 'These are your own choices.'}
          </p>
          <FormMessage kind="error">{save.error?.message}</FormMessage>
          <FormMessage kind="success">{save.isSuccess ? 'Saved.' : null}</FormMessage>
          <div className="flex gap-3">
            <button type="button" className="btn btn-secondary btn-small" onClick={() => setAll(true)}>
              Everything
            </button>
            <button type="button" className="btn btn-secondary btn-small" onClick={() => setAll(false)}>
              Nothing
            </button>
          </div>
          <div className="table-wrap">
            <table className="data-table">
              <caption className="sr-only">Mail per district</caption>
              <thead>
                <tr>
                  <th scope="col">District</th>
                  <th scope="col">Advisories</th>
                  <th scope="col">Weekly bulletin</th>
                </tr>
              </thead>
              <tbody>
                {subs.data.districts.map((d) => {
                  const c = choice.find((x) => x.districtId === d.districtId);
                  return (
                    <tr key={d.districtId}>
                      <td>
                        {d.districtName} ({d.districtCode})
                      </td>
                      {(['advisory', 'bulletin'] as const).map((k) => (
                        <td key={k}>
                          <input
                            type="checkbox"
                            className="checkbox"
                            aria-label={`${k === 'advisory' ? 'Advisories' : 'Weekly bulletin'} for ${d.districtName}`}
                            checked={c?.[k] ?? false}
                            onChange={(e) => set(d.districtId, k, e.currentTarget.checked)}
                          />
                        </td>
                      ))}
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          <button type="submit" className="btn btn-primary" disabled={save.isPending}>
            {save.isPending ? 'Saving…' : 'Save my preferences'}
          </button>
        </form>
      )}
    </section>
  );
}
