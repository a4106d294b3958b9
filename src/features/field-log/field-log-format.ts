import type { TFunction } from 'i18next';
import { fieldErrorText } from '../../lib/error-text';

/**
 * The field-record schema's messages (shared/api/field-records.schema.ts) as whole sentences naming the
 * field, in the interface language (`field-log:validation.*`); any other message goes to the app-wide
 * wording (fieldErrorText), which shows it as it is when it does not know it.
 */
const KNOWN: Record<string, string> = {
  'is required': 'required',
  'is too long': 'tooLong',
  'must be a number': 'number',
  'must be a whole number': 'wholeNumber',
  'cannot be negative': 'negative',
  'is implausibly large': 'tooLarge',
  'must be more than 0': 'moreThanZero',
  'must be a date (YYYY-MM-DD)': 'date',
  'cannot be in the future': 'future',
  'must be an id (UUID)': 'id',
  'is not a known kind of work': 'kind',
  'is not a known unit (ml, l, g, kg)': 'unit',
  'is required with an amount': 'requiredWithAmount',
};

export function recordMessage(t: TFunction, label: string, message: string | undefined): string | undefined {
  if (!message) return undefined;
  const key = KNOWN[message];
  return key ? t(`field-log:validation.${key}`, { field: label }) : fieldErrorText(label, message);
}

/** A form field's label for a path the server names ("body.amountUnit" → "Unit"). */
export const RECORD_LABEL_KEYS: Record<string, string> = {
  districtId: 'form.districtId',
  locality: 'form.locality',
  date: 'form.date',
  kind: 'form.kind',
  housesVisited: 'form.housesVisited',
  containers: 'form.containers',
  areaM2: 'form.areaM2',
  product: 'form.product',
  amount: 'form.amount',
  amountUnit: 'form.amountUnit',
  notes: 'form.notes',
};

/** Monday of the week holding `iso` (YYYY-MM-DD), as YYYY-MM-DD (calendar arithmetic in UTC, no time zone shift). */
export function mondayOf(iso: string): string {
  const d = new Date(`${iso}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() - ((d.getUTCDay() + 6) % 7));
  return d.toISOString().slice(0, 10);
}
