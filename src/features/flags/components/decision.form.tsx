import { useId, useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { FlagDto } from '../../../../shared/api/flags.schema';
import { FormMessage } from '../../../components/form';
import { isApiError } from '../../../lib/api-client';
import { useSession } from '../../../app/session';
import { useApproveFlag, useRejectFlag } from '../api/decide-flag.api';
import { useRenderMessage } from '../message';

/**
 * Sign-off of one open flag: approve (the message can be edited first) or reject with a reason. The flag's
 * version goes with the decision, so a flag another supervisor decided meanwhile is refused, and said so.
 * The message is shown in the supervisor's language, worded from the numbers (for a superseded flag, from
 * the district's tier now); left as shown, none is sent and every reader gets it in their own language.
 * A lapsed flag can only be rejected.
 */
export function DecisionForm({ flag }: { flag: FlagDto }) {
  const { t } = useTranslation('flags');
  const id = useId();
  const me = useSession();
  const approve = useApproveFlag();
  const reject = useRejectFlag();
  const render = useRenderMessage();
  const proposed = render(flag.proposal);
  const lapsed = flag.status === 'lapsed';
  const [message, setMessage] = useState(proposed);
  const [reason, setReason] = useState('');
  const [chosen, setMode] = useState<'approve' | 'reject'>('approve');
  const mode = lapsed ? 'reject' : chosen;
  if (flag.status !== 'open' && !lapsed) return null;
  if (flag.raisedBy?.id === me.id) return <FormMessage kind="info">{t('decision.ownFlag')}</FormMessage>;

  const error = approve.error ?? reject.error;
  const errorText = error
    ? isApiError(error) && error.code === 'flag_decided'
      ? t('decision.decidedMeanwhile')
      : isApiError(error) && error.code === 'flag_changed'
        ? t('decision.changedMeanwhile')
        : isApiError(error) && error.code === 'flag_lapsed'
          ? t('decision.lapsedMeanwhile')
          : error.message
    : null;
  const busy = approve.isPending || reject.isPending;
  const done = approve.isSuccess ? t('decision.approved') : reject.isSuccess ? t('decision.rejected') : null;

  return (
    <div className="space-y-3 border-t border-line pt-3">
      <FormMessage kind="error">{errorText}</FormMessage>
      <FormMessage kind="success">{done}</FormMessage>
      {lapsed ? <FormMessage kind="info">{t('decision.lapsedNoApprove')}</FormMessage> : null}
      <div role="radiogroup" aria-label={t('decision.label')} className="flex flex-wrap gap-4" hidden={lapsed}>
        <label className="flex min-h-6 items-center gap-2 py-1">
          <input type="radio" className="size-5" name={`${id}-mode`} checked={mode === 'approve'} onChange={() => setMode('approve')} /> {t('decision.approve')}
        </label>
        <label className="flex min-h-6 items-center gap-2 py-1">
          <input type="radio" className="size-5" name={`${id}-mode`} checked={mode === 'reject'} onChange={() => setMode('reject')} /> {t('decision.reject')}
        </label>
      </div>
      {mode === 'approve' ? (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            approve.mutate({ id: flag.id, body: { version: flag.version, ...(message.trim() !== proposed.trim() ? { message: message.trim() } : {}) } });
          }}
        >
          <label htmlFor={`${id}-message`} className="field-label">
            {flag.superseded ? t('decision.messageSuperseded') : t('decision.message')}
          </label>
          <textarea id={`${id}-message`} className="input min-h-32" value={message} onChange={(e) => setMessage(e.currentTarget.value)} maxLength={2000} />
          <button type="submit" className="btn btn-primary" disabled={busy || message.trim().length < 10}>
            {approve.isPending ? t('decision.approving') : t('decision.approveAndSend')}
          </button>
        </form>
      ) : (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            reject.mutate({ id: flag.id, body: { version: flag.version, reason: reason.trim() } });
          }}
        >
          <label htmlFor={`${id}-reason`} className="field-label">
            {t('decision.reason')}
          </label>
          <textarea id={`${id}-reason`} className="input" value={reason} onChange={(e) => setReason(e.currentTarget.value)} maxLength={500} />
          <button type="submit" className="btn btn-secondary" disabled={busy || reason.trim().length < 3}>
            {reject.isPending ? t('decision.rejecting') : t('decision.rejectFlag')}
          </button>
        </form>
      )}
    </div>
  );
}
