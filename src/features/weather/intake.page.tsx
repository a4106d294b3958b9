import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import type { UploadDto } from '../../../shared/api/weather.schema';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useFormat } from '../../i18n/format';
import { isApiError } from '../../lib/api-client';
import { errorText } from '../../lib/error-text';
import { usePullFeed } from './api/correct.api';
import { useUploads } from './api/uploads.api';
import { ConflictsList } from './components/conflicts.list';
import { CorrectionForm } from './components/correction.form';
import { UploadForm } from './components/upload.form';
import { UploadResult } from './components/upload-result';

/** Intake of weather: upload a file, follow its checks, read and download the row report, correct a day. */
export function IntakePage() {
  const { t } = useTranslation('weather');
  const { number, dateTime } = useFormat();
  const [current, setCurrent] = useState<UploadDto | null>(null);
  const uploads = useUploads();
  const feed = usePullFeed();
  return (
    <section aria-labelledby="page-title" className="space-y-8">
      <PageHeading lead={t('intake.lead')}>{t('intake.title')}</PageHeading>
      <p className="text-sm">
        <Link className="link inline-block py-1" to="/weather/stations">
          {t('intake.stations')}
        </Link>{' '}
        ·{' '}
        <Link className="link inline-block py-1" to="/weather/districts">
          {t('intake.districtWeather')}
        </Link>
      </p>
      <div className="card">
        <UploadForm onUploaded={setCurrent} />
      </div>
      {current ? <UploadResult key={current.id} initial={current} /> : null}
      <div className="card space-y-3">
        <h2 className="section-title">{t('intake.feedTitle')}</h2>
        <p className="text-sm text-ink-muted">{t('intake.feedText')}</p>
        {feed.isError ? <FormMessage kind="error">{isApiError(feed.error) ? errorText(feed.error) : t('intake.feedFailed')}</FormMessage> : null}
        <button type="button" className="btn btn-secondary" disabled={feed.isPending} onClick={() => feed.mutate(undefined, { onSuccess: setCurrent })}>
          {feed.isPending ? t('intake.pulling') : t('intake.pull')}
        </button>
      </div>
      <ConflictsList />
      <div className="card">
        <CorrectionForm from={null} />
      </div>
      <section aria-labelledby="recent-title" className="space-y-2">
        <h2 id="recent-title" className="section-title">
          {t('intake.recent')}
        </h2>
        {uploads.data?.length ? (
          <ul className="divide-y divide-line rounded-md border border-line bg-surface">
            {uploads.data.map((u) => (
              <li key={u.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2 text-sm">
                <span>
                  <span className="font-bold break-all">{u.fileName ?? t(`intake.source.${u.source}`)}</span> · {dateTime(u.createdAt)} ·{' '}
                  {t(`intake.status.${u.status}`)}
                  {u.status === 'done'
                    ? ` · ${t('intake.counts', { accepted: number(u.rowsAccepted), flagged: number(u.rowsFlagged), rejected: number(u.rowsRejected) })}`
                      + (u.rowsHeld ? ` · ${t('intake.heldCount', { held: number(u.rowsHeld) })}` : '')
                    : ''}
                </span>
                <button type="button" className="btn btn-secondary btn-small" onClick={() => setCurrent(u)}>
                  {t('intake.openReport')}
                </button>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-ink-muted">{uploads.isPending ? t('intake.loading') : t('intake.none')}</p>
        )}
      </section>
    </section>
  );
}
