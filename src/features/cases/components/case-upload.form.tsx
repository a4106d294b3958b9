import { useId, useRef, useState, type FormEvent } from 'react';
import { Trans, useTranslation } from 'react-i18next';
import type { UploadReport } from '../../../../shared/api/cases.schema';
import { FormMessage } from '../../../components/form';
import { errorText } from '../../../lib/error-text';
import { UploadRejected, useUploadCases } from '../api/upload-cases.api';

const MAX_BYTES = 2 * 1024 * 1024;

/** Upload a CSV of weekly counts; shows the row-level report. All rows load, or none. */
export function CaseUploadForm() {
  const { t } = useTranslation('cases');
  const upload = useUploadCases();
  const inputId = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [reason, setReason] = useState('');
  const [outcome, setOutcome] = useState<{ kind: 'success' | 'error'; text: string; report?: UploadReport | null } | null>(null);

  const onSubmit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    setOutcome(null);
    const file = fileRef.current?.files?.[0];
    if (!file) return setOutcome({ kind: 'error', text: t('upload.chooseFile') });
    if (file.size > MAX_BYTES) return setOutcome({ kind: 'error', text: t('upload.tooLarge', { file: file.name }) });
    try {
      const report = await upload.mutateAsync({ file, reason });
      setOutcome({
        kind: 'success',
        text: t(report.late ? 'upload.doneLate' : 'upload.done', {
          file: file.name,
          rows: report.rows,
          created: report.created,
          corrected: report.corrected,
          unchanged: report.unchanged,
          late: report.late,
        }),
      });
      if (fileRef.current) fileRef.current.value = '';
    } catch (error) {
      setOutcome({
        kind: 'error',
        text: error instanceof Error ? errorText(error) : t('upload.failed'),
        report: error instanceof UploadRejected ? error.report : null,
      });
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby="upload-title">
      <h2 id="upload-title" className="section-title">
        {t('upload.title')}
      </h2>
      <p className="break-words text-sm text-ink-muted">
        <Trans t={t} i18nKey="upload.help" components={[<code key="header" className="font-mono" />]} />
      </p>
      {outcome ? (
        <FormMessage kind={outcome.kind}>
          <p>{outcome.text}</p>
        </FormMessage>
      ) : null}
      {outcome?.report?.problems.length ? (
        <div className="table-wrap">
          <table className="data-table" data-testid="upload-report">
            <caption className="table-caption">{t('upload.problems')}</caption>
            <thead>
              <tr>
                <th scope="col">{t('upload.row')}</th>
                <th scope="col">{t('upload.column')}</th>
                <th scope="col">{t('upload.value')}</th>
                <th scope="col">{t('upload.reason')}</th>
              </tr>
            </thead>
            <tbody>
              {outcome.report.problems.map((p, i) => (
                <tr key={i}>
                  <td className="tabular-nums">{p.row || '—'}</td>
                  <td>{p.column ?? '—'}</td>
                  <td className="font-mono text-sm">{p.value ?? '—'}</td>
                  <td>{p.reason}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      <div className="field">
        <label htmlFor={inputId} className="field-label">
          {t('upload.file')}
        </label>
        <input id={inputId} ref={fileRef} type="file" className="input" accept=".csv,text/csv" />
      </div>
      <div className="field">
        <label htmlFor={`${inputId}-reason`} className="field-label">
          {t('upload.correctionReason')}
        </label>
        <input id={`${inputId}-reason`} className="input" value={reason} onChange={(e) => setReason(e.currentTarget.value)} />
      </div>
      <button type="submit" className="btn btn-primary btn-small" disabled={upload.isPending}>
        {upload.isPending ? t('upload.uploading') : t('upload.submit')}
      </button>
    </form>
  );
}
