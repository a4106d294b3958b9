import { useTranslation } from 'react-i18next';
import type { FieldRecordDto } from '../../../../shared/api/field-records.schema';
import { useFormat } from '../../../i18n/format';

/** What a record covered, in words ("120 houses visited · 45 containers · 800 m²"); null when no coverage was given. */
export function useCoverageText() {
  const { t } = useTranslation(['field-log']);
  const { number } = useFormat();
  return (r: Pick<FieldRecordDto, 'housesVisited' | 'containers' | 'areaM2'>): string | null => {
    const parts = [
      r.housesVisited === null ? null : t('field-log:coverage.houses', { count: r.housesVisited, value: number(r.housesVisited) }),
      r.containers === null ? null : t('field-log:coverage.containers', { count: r.containers, value: number(r.containers) }),
      r.areaM2 === null ? null : t('field-log:coverage.area', { value: number(r.areaM2, 1) }),
    ].filter((x): x is string => x !== null);
    return parts.length ? parts.join(' · ') : null;
  };
}

/** Records the server has accepted (the caller's own, newest first). */
export function FieldRecordsList({ records }: { records: FieldRecordDto[] }) {
  const { t } = useTranslation(['field-log', 'field-week']);
  const { date, number } = useFormat();
  const coverage = useCoverageText();
  if (records.length === 0) return <p className="text-sm text-ink-muted">{t('sent.empty')}</p>;
  return (
    <ul className="space-y-2" data-testid="sent-records">
      {records.map((r) => (
        <li key={r.id} className="min-w-0 break-words rounded-md border border-line bg-surface p-3 text-sm">
          <p className="font-bold">
            {r.locality} · {date(r.date)}
          </p>
          <p>
            {t(`field-week:kinds.${r.kind}`)} · {r.district.code} — {r.district.name}
          </p>
          <p className="text-ink-muted">{coverage(r) ?? t('coverage.none')}</p>
          {r.product ? (
            <p className="text-ink-muted">
              {r.amount === null ? r.product : t('sent.productAmount', { product: r.product, amount: number(r.amount, 2), unit: r.amountUnit ? t(`units.${r.amountUnit}`) : '' })}
            </p>
          ) : null}
          {r.notes ? <p className="text-ink-muted">{r.notes}</p> : null}
        </li>
      ))}
    </ul>
  );
}
