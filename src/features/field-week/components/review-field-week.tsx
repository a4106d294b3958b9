import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { FormMessage, TextField } from '../../../components/form';
import { isApiError } from '../../../lib/api-client';
import { errorText } from '../../../lib/error-text';
import { useReviewFieldWeek } from '../api/review-field-week.api';

/** The supervisor's decision on a week waiting for approval: approve (members mailed) or send back with a reason. */
export function ReviewFieldWeek({ id, weekStart }: { id: string; weekStart: string | null }) {
  const { t } = useTranslation('field-week');
  const review = useReviewFieldWeek(weekStart);
  const [reason, setReason] = useState('');
  return (
    <div className="card mb-6 space-y-3">
      <h2 className="section-title">{t('review.title')}</h2>
      <TextField label={t('review.reason')} hint={t('review.reasonHint')} value={reason} maxLength={500} onChange={(e) => setReason(e.currentTarget.value)}
        error={isApiError(review.error) ? review.error.fieldMessage('reason') : undefined} />
      <FormMessage kind="error">{review.error ? errorText(review.error) : null}</FormMessage>
      <div className="flex flex-wrap gap-3">
        <button type="button" className="btn btn-primary" disabled={review.isPending} onClick={() => review.mutate({ id })}>{t('review.approve')}</button>
        <button type="button" className="btn btn-secondary" disabled={review.isPending} onClick={() => review.mutate({ id, reason })}>{t('review.sendBack')}</button>
      </div>
    </div>
  );
}
