import { useId, useRef, useState, type FormEvent } from 'react';
import type { UploadDto } from '../../../../shared/api/weather.schema';
import { FormMessage, SelectField } from '../../../components/form';
import { isApiError } from '../../../lib/api-client';
import { uploadWeatherFile } from '../api/upload-file.api';
import { ProgressBar } from './progress-bar';

/** The weather file, its units, and the sending progress. Hands the new upload to the page, which follows its checks. */
export function UploadForm({ onUploaded }: { onUploaded: (u: UploadDto) => void }) {
  const fileId = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [tempUnit, setTempUnit] = useState<'C' | 'F'>('C');
  const [rainUnit, setRainUnit] = useState<'mm' | 'in'>('mm');
  const [sent, setSent] = useState<{ loaded: number; total: number } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    setError(null);
    const file = fileRef.current?.files?.[0];
    if (!file) {
      setError('Choose a CSV file first.');
      return;
    }
    setBusy(true);
    setSent({ loaded: 0, total: file.size });
    try {
      const upload = await uploadWeatherFile(file, { tempUnit, rainUnit }, (loaded, total) => setSent({ loaded, total })).done;
      onUploaded(upload);
      if (fileRef.current) fileRef.current.value = '';
    } catch (err) {
      setError(isApiError(err) ? (err.status === 413 ? `${file.name} is over the size limit of the server.` : err.message) : 'The upload failed.');
    } finally {
      setBusy(false);
      setSent(null);
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="upload-title">
      <h2 id="upload-title" className="section-title">
        Upload daily station weather
      </h2>
      <p className="text-sm text-ink-muted">
        A CSV file with the header <code className="font-mono">station,date,tmin,tmax,rh,rain</code> (rh and rain optional;
        <code className="font-mono"> dewpoint</code> instead of rh is accepted). Dates as YYYY-MM-DD. Uploading a file again changes
        only the rows whose values differ; earlier values stay in the revisions.
      </p>
      {error ? <FormMessage kind="error">{error}</FormMessage> : null}
      <div className="grid gap-3 sm:grid-cols-3">
        <div className="field">
          <label htmlFor={fileId} className="field-label">
            Weather file (CSV)
          </label>
          <input id={fileId} ref={fileRef} type="file" accept=".csv,text/csv" className="input" />
        </div>
        <SelectField label="Temperatures in" value={tempUnit} onChange={(e) => setTempUnit(e.currentTarget.value as 'C' | 'F')}>
          <option value="C">°C</option>
          <option value="F">°F</option>
        </SelectField>
        <SelectField label="Rainfall in" value={rainUnit} onChange={(e) => setRainUnit(e.currentTarget.value as 'mm' | 'in')}>
          <option value="mm">millimetres</option>
          <option value="in">inches</option>
        </SelectField>
      </div>
      {sent ? (
        <ProgressBar label="Sending the file" value={sent.loaded} max={sent.total} detail={`${(sent.loaded / 1e6).toFixed(1)} of ${(sent.total / 1e6).toFixed(1)} MB`} />
      ) : null}
      <button type="submit" className="btn btn-primary" disabled={busy}>
        {busy ? 'Sending…' : 'Upload and check'}
      </button>
    </form>
  );
}
