import { useState } from 'react';
import { FormMessage, SelectField } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useDistricts } from '../districts/api/districts.api';
import { bulletinHtmlUrl, bulletinPdfUrl, useBulletinPreview, useSendBulletin } from './api/bulletins.api';
import { DeliveryLog } from './components/delivery-log';

/** This week's bulletin before it goes (supervisor): each district's HTML and PDF, send now, and the delivery log. */
export function BulletinPage() {
  const districts = useDistricts();
  const [chosen, setChosen] = useState<string | null>(null);
  const districtId = chosen ?? districts.data?.[0]?.id ?? null;
  const preview = useBulletinPreview(districtId);
  const send = useSendBulletin();

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="Every week each district’s subscribers get a bulletin by mail: the region’s ranking, the district’s tier and drivers, cases against the channel, open advisories, what to do and the cautions, in HTML, plain text and an attached PDF. It goes out on schedule; you can preview it here and send it now.">
        Weekly bulletin
      </PageHeading>
      <div className="card mb-6 space-y-4">
        <SelectField label="District" value={districtId ?? ''} onChange={(e) => setChosen(e.currentTarget.value)}>
          {(districts.data ?? []).map((d) => (
            <option key={d.id} value={d.id}>
              {d.name} ({d.code})
            </option>
          ))}
        </SelectField>
        {preview.isError ? <FormMessage kind="error">{preview.error.message}</FormMessage> : null}
        {preview.data ? (
          <div className="space-y-2">
            <p>
              <strong>{preview.data.subject}</strong>
            </p>
            <p className="text-sm text-ink-muted">
              {preview.data.recipients} subscriber{preview.data.recipients === 1 ? '' : 's'} ·{' '}
              {preview.data.alreadySent ? 'already written and queued for this week' : 'not sent yet this week'} ·{' '}
              <a className="link" href={bulletinPdfUrl(preview.data.districtId)}>
                Download the PDF
              </a>
            </p>
            <iframe
              title={`Bulletin preview for ${preview.data.districtName}`}
              src={bulletinHtmlUrl(preview.data.districtId)}
              sandbox=""
              className="h-[36rem] w-full rounded-md border border-line bg-white"
            />
            <details>
              <summary className="cursor-pointer text-sm font-bold">Plain-text version</summary>
              <pre className="mt-2 whitespace-pre-wrap text-sm">{preview.data.text}</pre>
            </details>
          </div>
        ) : preview.isPending && districtId ? (
          <p className="text-ink-muted">Loading the preview…</p>
        ) : null}
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" className="btn btn-primary" onClick={() => send.mutate()} disabled={send.isPending}>
            {send.isPending ? 'Writing the bulletins…' : 'Send this week’s bulletin now'}
          </button>
          <span className="text-sm text-ink-muted">Districts already sent this week are skipped, so nobody gets it twice.</span>
        </div>
        <FormMessage kind="error">{send.error?.message}</FormMessage>
        <FormMessage kind="success">
          {send.data
            ? `Week ${send.data.epiWeek ?? '—'}: ${send.data.bulletinsWritten} bulletin${send.data.bulletinsWritten === 1 ? '' : 's'} written, ${send.data.messagesQueued} mail${send.data.messagesQueued === 1 ? '' : 's'} queued, ${send.data.districtsSkipped} district${send.data.districtsSkipped === 1 ? '' : 's'} skipped.`
            : null}
        </FormMessage>
      </div>
      <h2 className="section-title">Mail delivery</h2>
      <DeliveryLog />
    </section>
  );
}
