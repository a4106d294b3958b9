import { FormMessage } from '../../../components/form';
import { useDistrictSurveys } from '../api/district-surveys.api';
import { formatIndex } from '../survey-format';

/** A district's larval indices per epidemiological week (counts pooled) and its latest surveys. */
export function DistrictSurveys({ districtId, limit = 10 }: { districtId: string; limit?: number }) {
  const surveys = useDistrictSurveys(districtId);
  if (surveys.isPending) return <p className="text-ink-muted">Loading surveys…</p>;
  if (surveys.isError) return <FormMessage kind="error">{surveys.error.message}</FormMessage>;
  const { weeks, surveys: list } = surveys.data;
  if (list.length === 0) return <p className="text-sm text-ink-muted">No larval surveys recorded for {surveys.data.district.name} yet.</p>;
  return (
    <div className="space-y-4">
      <div className="table-wrap">
        <table className="data-table">
          <caption className="table-caption">Larval indices per week, {surveys.data.district.name} (counts of the week’s surveys pooled)</caption>
          <thead>
            <tr>
              <th scope="col">Week</th>
              <th scope="col">Surveys</th>
              <th scope="col">Houses</th>
              <th scope="col">House index</th>
              <th scope="col">Container index</th>
              <th scope="col">Breteau index</th>
              <th scope="col">Pupa index</th>
            </tr>
          </thead>
          <tbody>
            {weeks.slice(0, limit).map((w) => (
              <tr key={`${w.year}-${w.week}`}>
                <td className="tabular-nums">
                  {w.year} week {w.week}
                </td>
                <td className="tabular-nums">{w.surveys}</td>
                <td className="tabular-nums">{w.houses}</td>
                <td className="tabular-nums">{formatIndex(w.indices.house, '%')}</td>
                <td className="tabular-nums">{formatIndex(w.indices.container, '%')}</td>
                <td className="tabular-nums">{formatIndex(w.indices.breteau)}</td>
                <td className="tabular-nums">{formatIndex(w.indices.pupa)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <ul className="space-y-1 text-sm" aria-label="Latest surveys">
        {list.slice(0, limit).map((s) => (
          <li key={s.id}>
            <span className="font-bold">{s.locality}</span>, {s.date}: {s.housesPositive} of {s.housesInspected} houses positive, House index{' '}
            {formatIndex(s.indices.house, '%')}, Breteau {formatIndex(s.indices.breteau)}
          </li>
        ))}
      </ul>
    </div>
  );
}
