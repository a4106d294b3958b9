import { useEffect, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { weatherKeys } from '../api/weather-keys';
import { useTranslation } from 'react-i18next';
import { useFormat } from '../../../i18n/format';
import type { IssueDto, UploadDto } from '../../../../shared/api/weather.schema';
import { FormMessage } from '../../../components/form';
import { useUpload } from '../api/uploads.api';
import { refusalText } from '../refusal-text';
import { CorrectionForm } from './correction.form';
import { IssuesTable } from './issues.table';
import { ProgressBar } from './progress-bar';

/** One intake: the server's checking progress while it runs, then the counts and the row report. */
/** A refused (or failed) upload: why, in the interface language, and that nothing from it was saved. */
function RefusalMessage({ upload: u }: { upload: UploadDto }) {
  const { t, i18n } = useTranslation('weather');
  const format = useFormat();
  const said = refusalText(u.reasonCode, u.reasonParams, u.message, t, format, i18n.language);
  return (
    <FormMessage kind="error">
      {u.status === 'refused' ? <span className="block font-bold">{t('refusal.title')}</span> : null}
      {said ? said.text : u.message}
      {said?.detail ? <span className="block text-xs">{said.detail}</span> : null}
    </FormMessage>
  );
}

export function UploadResult({ initial }: { initial: UploadDto }) {
  const { t } = useTranslation('weather');
  const { number: n } = useFormat();
  const upload = useUpload(initial.id);
  const u = upload.data ?? initial;
  const queryClient = useQueryClient();
  // "Recent intakes" shows the new upload at once and again with its counts when the checks end.
  useEffect(() => {
    void queryClient.invalidateQueries({ queryKey: weatherKeys.uploads, exact: true });
  }, [queryClient, u.status]);
  const [fixing, setFixing] = useState<IssueDto | null>(null);
  return (
    <section aria-labelledby="result-title" className="card space-y-4" aria-live="polite">
      <h2 id="result-title" className="section-title">
        {t('result.title', { name: u.fileName ?? t(`intake.source.${u.source}`), status: t(`result.status.${u.status}`) })}
      </h2>
      {u.status === 'processing' ? (
        <ProgressBar
          label={t('result.checking')}
          value={u.bytesProcessed}
          max={u.bytesTotal || 1}
          detail={t('result.rowsChecked', { rows: n(u.rowsProcessed) })}
        />
      ) : null}
      {u.status === 'refused' || u.status === 'failed' ? <RefusalMessage upload={u} /> : null}
      {u.status === 'done' ? (
        <>
          <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            {[
              [t('result.accepted'), u.rowsAccepted],
              [t('result.flagged'), u.rowsFlagged],
              [t('result.rejected'), u.rowsRejected],
              [t('result.replaced'), u.rowsReplaced],
              [t('result.held'), u.rowsHeld ?? 0],
              [t('result.conflicting'), u.rowsConflicting ?? 0],
            ].map(([label, value]) => (
              <div key={label as string} className="rounded-md border border-line p-3">
                <dt className="text-sm text-ink-muted">{label}</dt>
                <dd className="text-2xl font-bold tabular-nums">{n(value as number)}</dd>
              </div>
            ))}
          </dl>
          {u.rowsHeld ? <FormMessage kind="info">{t('result.heldNotice')}</FormMessage> : null}
          {u.rowsConflicting ? <FormMessage kind="info">{t('result.conflictingNotice')}</FormMessage> : null}
          {u.message ? <FormMessage kind="info">{u.message}</FormMessage> : null}
          <IssuesTable upload={u} onFix={setFixing} />
          {fixing ? <CorrectionForm key={`${fixing.station}-${fixing.date}-${fixing.rowNumber}`} from={fixing} /> : null}
        </>
      ) : null}
    </section>
  );
}
