import { useId } from 'react';
import { useTranslation } from 'react-i18next';
import type { DistrictFieldWorkResponse } from '../../../../shared/api/field-records.schema';
import { FormMessage } from '../../../components/form';
import { useFormat } from '../../../i18n/format';
import { errorText } from '../../../lib/error-text';
import { useCoverageText } from '../../field-log/components/field-records.list';
import { useDistrictFieldWork } from '../api/district-field-work.api';

type Side = DistrictFieldWorkResponse['records'][number]['before'];
const INDICES = ['house', 'container', 'breteau'] as const;

/**
 * The District file's "Field work" panel (issue 19, item 4): each piece of work recorded in the district
 * (date, kind, coverage), with the pooled larval indices (HI, CI, BI) of the surveys before and after it
 * and how many surveys each side holds. Where a side has too few surveys it says so in words and shows no
 * comparison; where both sides have enough it shows them side by side, never claiming an effect.
 */
export function FieldWorkPanel({ districtId }: { districtId: string }) {
  const id = useId();
  const { t } = useTranslation(['field-log', 'field-week']);
  const { date } = useFormat();
  const coverage = useCoverageText();
  const work = useDistrictFieldWork(districtId);
  return (
    <section aria-labelledby={`${id}-title`} className="card space-y-3" data-testid="field-work">
      <h2 id={`${id}-title`} className="text-xl font-bold">
        {t('fieldWork.title')}
      </h2>
      {work.isPending ? (
        <p className="text-ink-muted">{t('fieldWork.loading')}</p>
      ) : work.isError ? (
        <FormMessage kind="error">{errorText(work.error)}</FormMessage>
      ) : work.data.records.length === 0 ? (
        <p className="text-ink-muted">{t('fieldWork.empty')}</p>
      ) : (
        <>
          <p className="text-sm text-ink-muted">{t('fieldWork.lead', { days: work.data.rule.windowDays })}</p>
          <ol className="space-y-3">
            {work.data.records.map((r) => (
              <li key={r.id} className="min-w-0 break-words rounded-md border border-line p-3 text-sm">
                <p className="font-bold">
                  {date(r.date)} · {t(`field-week:kinds.${r.kind}`)}
                </p>
                <p>
                  {r.locality} · {coverage(r) ?? t('coverage.none')}
                </p>
                <div className="mt-2 grid gap-2 sm:grid-cols-2">
                  <SideBox label={t('fieldWork.before')} side={r.before} />
                  <SideBox label={t('fieldWork.after')} side={r.after} />
                </div>
                <p className={`mt-2 ${r.comparable ? 'text-ink-muted' : 'font-bold'}`}>
                  {r.comparable
                    ? t('fieldWork.compared', { min: work.data.rule.minSurveysPerSide })
                    : t('fieldWork.notCompared', { min: work.data.rule.minSurveysPerSide })}
                </p>
              </li>
            ))}
          </ol>
          <p className="text-sm text-ink-muted">{t('fieldWork.noClaim')}</p>
        </>
      )}
    </section>
  );
}

function SideBox({ label, side }: { label: string; side: Side }) {
  const { t } = useTranslation('field-log');
  const { number } = useFormat();
  return (
    <div className="rounded-md bg-surface p-2">
      <p className="font-bold">
        {label} <span className="font-normal text-ink-muted">({t('fieldWork.surveys', { count: side.surveys })})</span>
      </p>
      <dl className="mt-1 grid grid-cols-3 gap-x-2 tabular-nums">
        {INDICES.map((k) => (
          <div key={k}>
            <dt>
              <abbr title={t(`fieldWork.${k}Long`)}>{t(`fieldWork.${k}`)}</abbr>
            </dt>
            <dd>{side.indices[k] === null ? '—' : number(side.indices[k], 1, true)}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
