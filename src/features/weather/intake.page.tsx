import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { UploadDto } from '../../../shared/api/weather.schema';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { isApiError } from '../../lib/api-client';
import { usePullFeed } from './api/correct.api';
import { useUploads } from './api/uploads.api';
import { CorrectionForm } from './components/correction.form';
import { UploadForm } from './components/upload.form';
import { UploadResult } from './components/upload-result';

const STATUS: Record<UploadDto['status'], string> = { processing: 'Checking', done: 'Loaded', failed: 'Not loaded' };

/** Intake of weather: upload a file, follow its checks, read and download the row report, correct a day. */
export function IntakePage() {
  const [current, setCurrent] = useState<UploadDto | null>(null);
  const uploads = useUploads();
  const feed = usePullFeed();
  return (
    <section aria-labelledby="page-title" className="space-y-8">
      <PageHeading lead="Daily station weather in, checked row by row. Rejected rows are listed with the reason; flagged rows are kept and marked; short gaps in a district's series are filled and marked.">
        Intake
      </PageHeading>
      <p className="text-sm">
        <Link className="link" to="/weather/stations">Stations</Link> ·{' '}
        <Link className="link" to="/weather/districts">District weather</Link>
      </p>
      <div className="card">
        <UploadForm onUploaded={setCurrent} />
      </div>
      {current ? <UploadResult key={current.id} initial={current} /> : null}
      <div className="card space-y-3">
        <h2 className="section-title">Station-data feed</h2>
        <p className="text-sm text-ink-muted">The feed is pulled on its schedule; its rows pass the same checks as an upload.</p>
        {feed.isError ? <FormMessage kind="error">{isApiError(feed.error) ? feed.error.message : 'The feed could not be pulled.'}</FormMessage> : null}
        <button type="button" className="btn btn-secondary" disabled={feed.isPending} onClick={() => feed.mutate(undefined, { onSuccess: setCurrent })}>
          {feed.isPending ? 'Pulling…' : 'Pull the feed now'}
        </button>
      </div>
      <div className="card">
        <CorrectionForm from={null} />
      </div>
      <section aria-labelledby="recent-title" className="space-y-2">
        <h2 id="recent-title" className="section-title">Recent intakes</h2>
        {uploads.data?.length ? (
          <ul className="divide-y divide-line rounded-md border border-line bg-surface">
            {uploads.data.map((u) => (
              <li key={u.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2 text-sm">
                <span>
                  <span className="font-bold">{u.fileName ?? u.source}</span> · {new Date(u.createdAt).toLocaleString()} · {STATUS[u.status]}
                  {u.status === 'done' ? ` · ${u.rowsAccepted.toLocaleString('en')} accepted, ${u.rowsFlagged} flagged, ${u.rowsRejected} rejected` : ''}
                </span>
                <button type="button" className="btn btn-secondary btn-small" onClick={() => setCurrent(u)}>
                  Open the report
                </button>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-ink-muted">{uploads.isPending ? 'Loading…' : 'No intakes yet.'}</p>
        )}
      </section>
    </section>
  );
}
