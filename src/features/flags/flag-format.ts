import { FLAG_REASON_LABELS, FLAG_STATUS_LABELS, type FlagDto } from '../../../shared/api/flags.schema';

const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
export const formatWhen = (iso: string) => dateTime.format(new Date(iso));
export const reasonLabel = (f: Pick<FlagDto, 'reason'>) => FLAG_REASON_LABELS[f.reason];
export const statusLabel = (f: Pick<FlagDto, 'status'>) => FLAG_STATUS_LABELS[f.status];
export const raisedByLabel = (f: FlagDto) => (f.raisedBy ? f.raisedBy.displayName : 'The season run');

const ACTION_LABELS: Record<string, string> = {
  'flag.raised': 'Flag raised',
  'flag.approved': 'Approved',
  'flag.rejected': 'Rejected',
  'advisory.issued': 'Advisory queued for mail',
};
export const historyLabel = (action: string) => ACTION_LABELS[action] ?? action;
