import { useEffect, useState } from 'react';
import { Trans, useTranslation } from 'react-i18next';
import type { SubscriptionDto } from '../../../shared/api/bulletins.schema';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { errorText } from '../../lib/error-text';
import { useSaveSubscriptions, useSubscriptions } from './api/subscriptions.api';

type Choice = Pick<SubscriptionDto, 'districtId' | 'advisory' | 'bulletin'>;

/** Which districts' advisories and weekly bulletins come to me by mail (every signed-in role). */
export function PreferencesPage() {
  const { t } = useTranslation('subscriptions');
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
      <PageHeading lead={t('preferences.lead')}>{t('preferences.title')}</PageHeading>
      {subs.isPending ? (
        <p className="text-ink-muted">{t('preferences.loading')}</p>
      ) : subs.isError ? (
        <FormMessage kind="error">{errorText(subs.error)}</FormMessage>
      ) : (
        <form
          className="card space-y-4"
          onSubmit={(e) => {
            e.preventDefault();
            save.mutate({ districts: choice });
          }}
        >
          <p className="text-sm">
            <Trans t={t} i18nKey="preferences.mailTo" values={{ email: subs.data.email }} components={{ strong: <strong /> }} />{' '}
            {subs.data.source === 'default' ? t('preferences.defaults') : t('preferences.own')}
          </p>
          <FormMessage kind="error">{save.error ? errorText(save.error) : null}</FormMessage>
          <FormMessage kind="success">{save.isSuccess ? t('preferences.saved') : null}</FormMessage>
          <div className="flex gap-3">
            <button type="button" className="btn btn-secondary btn-small" onClick={() => setAll(true)}>
              {t('preferences.everything')}
            </button>
            <button type="button" className="btn btn-secondary btn-small" onClick={() => setAll(false)}>
              {t('preferences.nothing')}
            </button>
          </div>
          <div className="table-wrap">
            <table className="data-table">
              <caption className="sr-only">{t('preferences.caption')}</caption>
              <thead>
                <tr>
                  <th scope="col">{t('preferences.district')}</th>
                  <th scope="col">{t('preferences.advisories')}</th>
                  <th scope="col">{t('preferences.bulletin')}</th>
                </tr>
              </thead>
              <tbody>
                {subs.data.districts.map((d) => {
                  const c = choice.find((x) => x.districtId === d.districtId);
                  return (
                    <tr key={d.districtId}>
                      <th scope="row" className="font-normal">
                        {d.districtName} ({d.districtCode})
                      </th>
                      {(['advisory', 'bulletin'] as const).map((k) => (
                        <td key={k}>
                          <input
                            type="checkbox"
                            className="checkbox"
                            aria-label={t(k === 'advisory' ? 'preferences.advisoriesFor' : 'preferences.bulletinFor', { district: d.districtName })}
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
            {save.isPending ? t('preferences.saving') : t('preferences.submit')}
          </button>
        </form>
      )}
    </section>
  );
}
