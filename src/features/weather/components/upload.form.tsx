import { useId, useRef, useState, type FormEvent } from 'react';
import { Trans, useTranslation } from 'react-i18next';
import type { UploadDto } from '../../../../shared/api/weather.schema';
import { FormMessage, SelectField } from '../../../components/form';
import { isApiError } from '../../../lib/api-client';
import { errorText } from '../../../lib/error-text';
import { useFormat } from '../../../i18n/format';
import { useUnits } from '../../../lib/units';
import { uploadWeatherFile } from '../api/upload-file.api';
import { refusalText } from '../refusal-text';
import { ProgressBar } from './progress-bar';

/** The weather file, its units, and the sending progress. Hands the new upload to the page, which follows its checks. */
export function UploadForm({ onUploaded }: { onUploaded: (u: UploadDto) => void }) {
  const { t, i18n } = useTranslation('weather');
  const format = useFormat();
  const { number } = format;
  const units = useUnits();
  const fileId = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  // The file's units: the user's display units to start with (files from a station keep their own).
  const [tempUnit, setTempUnit] = useState<'C' | 'F'>(units.temperature);
  const [rainUnit, setRainUnit] = useState<'mm' | 'in'>(units.rain);
  const [sent, setSent] = useState<{ loaded: number; total: number } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setError(null);
    const file = fileRef.current?.files?.[0];
    if (!file) {
      setError(t('upload.chooseFile'));
      return;
    }
    setBusy(true);
    setSent({ loaded: 0, total: file.size });
    try {
      const upload = await uploadWeatherFile(file, { tempUnit, rainUnit }, (loaded, total) => setSent({ loaded, total })).done;
      onUploaded(upload);
      if (fileRef.current) fileRef.current.value = '';
    } catch (err) {
      // A file refused as a whole (422): why, in words, from the reason's code.
      const refused = isApiError(err) && err.status === 422 ? refusalText(err.code, err.params, err.message, t, format, i18n.language) : null;
      setError(
        refused
          ? [t('refusal.title'), refused.text, refused.detail].filter(Boolean).join(' ')
          : isApiError(err)
          ? err.status === 413
            ? t('upload.tooLarge', { file: file.name })
            : err.code === 'network_error'
              ? t('upload.interrupted')
              : err.code === 'aborted'
                ? t('upload.cancelled')
                : err.code === 'invalid_response'
                  ? t('upload.unreadable')
                  : errorText(err)
          : t('upload.failed'),
      );
    } finally {
      setBusy(false);
      setSent(null);
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="upload-title">
      <h2 id="upload-title" className="section-title">
        {t('upload.title')}
      </h2>
      <p className="break-words text-sm text-ink-muted">
        <Trans t={t} i18nKey="upload.help" components={[<code key="header" className="font-mono" />, <code key="dew" className="font-mono" />]} />
      </p>
      {error ? <FormMessage kind="error">{error}</FormMessage> : null}
      <div className="grid gap-3 sm:grid-cols-3">
        <div className="field">
          <label htmlFor={fileId} className="field-label">
            {t('upload.file')}
          </label>
          <input id={fileId} ref={fileRef} type="file" accept=".csv,text/csv" className="input" />
        </div>
        <SelectField label={t('upload.tempUnit')} value={tempUnit} onChange={(e) => setTempUnit(e.currentTarget.value as 'C' | 'F')}>
          <option value="C">°C</option>
          <option value="F">°F</option>
        </SelectField>
        <SelectField label={t('upload.rainUnit')} value={rainUnit} onChange={(e) => setRainUnit(e.currentTarget.value as 'mm' | 'in')}>
          <option value="mm">{t('upload.millimetres')}</option>
          <option value="in">{t('upload.inches')}</option>
        </SelectField>
      </div>
      {sent ? (
        <ProgressBar
          label={t('upload.sending')}
          value={sent.loaded}
          max={sent.total}
          detail={t('upload.sendingDetail', { sent: number(sent.loaded / 1e6, 1, true), total: number(sent.total / 1e6, 1, true) })}
        />
      ) : null}
      <button type="submit" className="btn btn-primary" disabled={busy}>
        {busy ? t('upload.busy') : t('upload.submit')}
      </button>
    </form>
  );
}
