import { useId, useRef, useState, type FormEvent } from 'react';
import type { UploadReport } from '../../../../shared/api/cases.schema';
import { FormMessage } from '../../../components/form';
import { UploadRejected, useUploadCases } from '../api/upload-cases.api';

const MAX_BYTES = 2 * 1024 * 1024;

/** Upload a CSV of weekly counts; shows the row-level report. All rows load, or none. */
export function CaseUploadForm() {
  const upload = useUploadCases();
  const inputId = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [reason, setReason] = useState('');
  const [outcome, setOutcome] = useState<{ kind: 'success' | 'error'; text: string; report?: UploadReport | null } | null>(null);

  const onSubmit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    setOutcome(null);
    const file = fileRef.current?.files?.[0];
    if (!file) return setOutcome({ kind: 'error', text: 'Choose a .csv file first.' });
    if (file.size > MAX_BYTES) return setOutcome({ kind: 'error', text: `${file.name} is larger than 2 MB: split it into several files.` });
    try {
      const report = await upload.mutateAsync({ file, reason });
      setOutcome({
        kind: 'success',
        text: `${file.name}: ${report.rows} rows read — ${report.created} new, ${report.corrected} corrected, ${report.unchanged} unchanged${report.late ? `, ${report.late} received late` : ''}.`,
      });
      if (fileRef.current) fileRef.current.value = '';
    } catch (error) {
      setOutcome({
        kind: 'error',
        text: error instanceof Error ? error.message : 'The file could not be loaded.',
        report: error instanceof UploadRejected ? error.report : null,
      });
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby="upload-title">
      <h2 id="upload-title" className="section-title">
        Upload counts
      </h2>
      <p className="text-sm text-ink-muted">
        A CSV with the header <code className="font-mono">district,year,week,disease,cases</code> (district and disease codes). The same file twice
        changes nothing; a row that changes a recorded count needs the reason below.
      </p>
      {outcome ? (
        <FormMessage kind={outcome.kind}>
          <p>{outcome.text}</p>
        </FormMessage>
      ) : null}
      {outcome?.report?.problems.length ? (
        <div className="table-wrap">
          <table className="data-table" data-testid="upload-report">
            <caption className="table-caption">Problems found (nothing was written)</caption>
            <thead>
              <tr>
                <th scope="col">Row</th>
                <th scope="col">Column</th>
                <th scope="col">Value</th>
                <th scope="col">Reason</th>
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
          CSV file
        </label>
        <input id={inputId} ref={fileRef} type="file" className="input" accept=".csv,text/csv" />
      </div>
      <div className="field">
        <label htmlFor={`${inputId}-reason`} className="field-label">
          Reason for any corrections (optional)
        </label>
        <input id={`${inputId}-reason`} className="input" value={reason} onChange={(e) => setReason(e.currentTarget.value)} />
      </div>
      <button type="submit" className="btn btn-primary btn-small" disabled={upload.isPending}>
        {upload.isPending ? 'Uploading…' : 'Upload the file'}
      </button>
    </form>
  );
}
