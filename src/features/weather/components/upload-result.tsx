import { useState } from 'react';
import type { IssueDto, UploadDto } from '../../../../shared/api/weather.schema';
import { FormMessage } from '../../../components/form';
import { useUpload } from '../api/uploads.api';
import { CorrectionForm } from './correction.form';
import { IssuesTable } from './issues.table';
import { ProgressBar } from './progress-bar';

const n = (x: number) => x.toLocaleString('en');

/** One intake: the server's checking progress while it runs, then the counts and the row report. */
export function UploadResult({ initial }: { initial: UploadDto }) {
  const upload = useUpload(initial.id);
  const u = upload.data ?? initial;
  const [fixing, setFixing] = useState<IssueDto | null>(null);
  return (
    <section aria-labelledby="result-title" className="card space-y-4" aria-live="polite">
      <h2 id="result-title" className="section-title">
        {u.fileName ?? (u.source === 'feed' ? 'Feed pull' : 'Correction')} — {u.status === 'processing' ? 'checking' : u.status === 'done' ? 'loaded' : 'not loaded'}
      </h2>
      {u.status === 'processing' ? (
        <ProgressBar
          label="Checking the rows"
          value={u.bytesProcessed}
          max={u.bytesTotal || 1}
          detail={`${n(u.rowsProcessed)} rows checked`}
        />
      ) : null}
      {u.status === 'failed' ? <FormMessage kind="error">{u.message}</FormMessage> : null}
      {u.status === 'done' ? (
        <>
          <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            {[
              ['Rows accepted', u.rowsAccepted],
              ['Rows flagged (kept)', u.rowsFlagged],
              ['Rows rejected', u.rowsRejected],
              ['Values replaced', u.rowsReplaced],
            ].map(([label, value]) => (
              <div key={label as string} className="rounded-md border border-line p-3">
                <dt className="text-sm text-ink-muted">{label}</dt>
                <dd className="text-2xl font-bold tabular-nums">{n(value as number)}</dd>
              </div>
            ))}
          </dl>
          {u.message ? <FormMessage kind="info">{u.message}</FormMessage> : null}
          <IssuesTable uploadId={u.id} onFix={setFixing} />
          {fixing ? <CorrectionForm key={`${fixing.station}-${fixing.date}-${fixing.rowNumber}`} from={fixing} /> : null}
        </>
      ) : null}
    </section>
  );
}
