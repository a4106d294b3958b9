import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { FormMessage, SelectField } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useFormat } from '../../i18n/format';
import { errorText } from '../../lib/error-text';
import { problemReasonText } from '../../lib/problem-text';
import { useDistricts } from '../districts/api/districts.api';
import { bulletinHtmlUrl, bulletinPdfUrl, useBulletinPreview, useSendBulletin } from './api/bulletins.api';
import { DeliveryLog } from './components/delivery-log';

/** This week's bulletin before it goes (supervisor): each district's HTML and PDF, send now, and the delivery log. */
export function BulletinPage() {
  const { t } = useTranslation('bulletins');
  const f = useFormat();
  const districts = useDistricts();
  const [chosen, setChosen] = useState<string | null>(null);
  const districtId = chosen ?? districts.data?.[0]?.id ?? null;
  const preview = useBulletinPreview(districtId);
  const send = useSendBulletin();

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('page.lead')}>{t('page.title')}</PageHeading>
      <div className="card mb-6 space-y-4">
        <SelectField label={t('page.district')} value={districtId ?? ''} onChange={(e) => setChosen(e.currentTarget.value)}>
          {(districts.data ?? []).map((d) => (
            <option key={d.id} value={d.id}>
              {d.name} ({d.code})
            </option>
          ))}
        </SelectField>
        {preview.isError ? <FormMessage kind="error">{errorText(preview.error)}</FormMessage> : null}
        {preview.data ? (
          <div className="space-y-2">
            <p>
              <strong>{preview.data.subject}</strong>
            </p>
            <p className="text-sm text-ink-muted">
              {t('page.subscribers', { count: preview.data.recipients, n: f.number(preview.data.recipients) })} ·{' '}
              {preview.data.alreadySent ? t('page.alreadySent') : t('page.notSent')} ·{' '}
              <a className="link" href={bulletinPdfUrl(preview.data.districtId)}>
                {t('page.downloadPdf')}
              </a>
            </p>
            <iframe
              title={t('page.previewTitle', { district: preview.data.districtName })}
              src={bulletinHtmlUrl(preview.data.districtId)}
              sandbox=""
              className="h-[36rem] w-full rounded-md border border-line bg-white"
            />
            <details>
              <summary className="cursor-pointer text-sm font-bold">{t('page.plainText')}</summary>
              <pre className="mt-2 whitespace-pre-wrap text-sm">{preview.data.text}</pre>
            </details>
          </div>
        ) : preview.isPending && districtId ? (
          <p className="text-ink-muted">{t('page.loadingPreview')}</p>
        ) : null}
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" className="btn btn-primary" onClick={() => send.mutate()} disabled={send.isPending}>
            {send.isPending ? t('page.sending') : t('page.send')}
          </button>
          <span className="text-sm text-ink-muted">{t('page.sendNote')}</span>
        </div>
        <FormMessage kind="error">{send.error ? errorText(send.error) : null}</FormMessage>
        <FormMessage kind="success">
          {send.data
            ? t('page.sent', {
                week:
                  send.data.epiWeek !== null && send.data.epiYear !== null
                    ? t('common:epiWeek', { week: send.data.epiWeek, year: send.data.epiYear })
                    : t('page.noWeek'),
                written: t('page.written', { count: send.data.bulletinsWritten, n: f.number(send.data.bulletinsWritten) }),
                queued: t('page.queued', { count: send.data.messagesQueued, n: f.number(send.data.messagesQueued) }),
                skipped: t('page.skipped', { count: send.data.districtsSkipped, n: f.number(send.data.districtsSkipped) }),
              })
            : null}
        </FormMessage>
        {send.data && send.data.districtsFailed.length > 0 ? (
          <FormMessage kind="error">
            {t('page.failed', {
              count: send.data.districtsFailed.length,
              list: send.data.districtsFailed.map((d) => t('page.failedItem', { district: d.districtName, reason: problemReasonText(d.reason) })).join('; '),
            })}
          </FormMessage>
        ) : null}
      </div>
      <h2 className="section-title">{t('page.delivery')}</h2>
      <DeliveryLog />
    </section>
  );
}
