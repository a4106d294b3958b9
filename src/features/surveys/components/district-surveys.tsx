import { useTranslation } from 'react-i18next';
import { FormMessage } from '../../../components/form';
import { useFormat } from '../../../i18n/format';
import { useDistrictSurveys } from '../api/district-surveys.api';
import { formatIndex } from '../survey-format';
import { errorText } from '../../../lib/error-text';
import { useSession } from '../../../app/session';
import { VoidAction } from '../../../components/void-dialog';
import { useVoidSurvey } from '../api/void-survey.api';
import { mayIn } from '../../../../shared/permissions';

/** A district's larval indices per epidemiological week (counts pooled) and its latest surveys. */
export function DistrictSurveys({ districtId, limit = 10 }: { districtId: string; limit?: number }) {
  const { t } = useTranslation('surveys');
  const { number, date } = useFormat();
  const surveys = useDistrictSurveys(districtId);
  const me = useSession();
  const voidSurvey = useVoidSurvey();
  // The roles that enter surveys may void one in their own districts (an officer sees all districts).
  const canVoid = mayIn(me.role, 'surveys.record', me.districts.some((d) => d.id === districtId));
  if (surveys.isPending) return <p className="text-ink-muted">{t('district.loading')}</p>;
  if (surveys.isError) return <FormMessage kind="error">{errorText(surveys.error)}</FormMessage>;
  const { weeks, surveys: list } = surveys.data;
  const district = surveys.data.district.name;
  if (list.length === 0) return <p className="text-sm text-ink-muted">{t('district.empty', { district })}</p>;
  return (
    <div className="space-y-4">
      <div className="table-wrap" tabIndex={0} role="region" aria-label={t('district.caption', { district })}>
        <table className="data-table">
          <caption className="table-caption">{t('district.caption', { district })}</caption>
          <thead>
            <tr>
              <th scope="col">{t('district.week')}</th>
              <th scope="col">{t('district.surveys')}</th>
              <th scope="col">{t('district.houses')}</th>
              <th scope="col">{t('index.house')}</th>
              <th scope="col">{t('index.container')}</th>
              <th scope="col">{t('index.breteau')}</th>
              <th scope="col">{t('index.pupa')}</th>
            </tr>
          </thead>
          <tbody>
            {weeks.slice(0, limit).map((w) => (
              <tr key={`${w.year}-${w.week}`}>
                <td className="tabular-nums whitespace-nowrap">{t('common:epiWeekShort', { week: w.week, year: w.year })}</td>
                <td className="tabular-nums">{number(w.surveys)}</td>
                <td className="tabular-nums">{number(w.houses)}</td>
                <td className="tabular-nums">{formatIndex(number, w.indices.house, t)}</td>
                <td className="tabular-nums">{formatIndex(number, w.indices.container, t)}</td>
                <td className="tabular-nums">{formatIndex(number, w.indices.breteau)}</td>
                <td className="tabular-nums">
                  {w.indices.pupa !== null && w.pupaSurveys < w.surveys
                    ? t('index.pupaPartial', { value: formatIndex(number, w.indices.pupa), counted: number(w.pupaSurveys), surveys: number(w.surveys) })
                    : formatIndex(number, w.indices.pupa)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <ul className="space-y-1 text-sm" aria-label={t('district.latest')}>
        {list.slice(0, limit).map((s) => (
          <li key={s.id} className="break-words">
            <span className={s.voided ? 'line-through' : undefined}>
              <span className="font-bold">{s.locality}</span>,{' '}
              {t('district.latestLine', {
                date: date(s.date),
                positive: number(s.housesPositive),
                inspected: number(s.housesInspected),
                house: formatIndex(number, s.indices.house, t),
                breteau: formatIndex(number, s.indices.breteau),
              })}
            </span>
            {s.voided ? (
              <span className="block font-bold">{t('district.voided', { reason: s.voided.reason })}</span>
            ) : canVoid ? (
              <VoidAction
                what={t('district.voidWhat', { locality: s.locality, date: date(s.date) })}
                onVoid={(reason) => voidSurvey.mutateAsync({ surveyId: s.id, reason })}
              />
            ) : null}
          </li>
        ))}
      </ul>
    </div>
  );
}
