import { useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import type { SignalsResponse } from '../../../../shared/api/cases.schema';
import { CheckboxGroup, FormMessage } from '../../../components/form';
import { formErrorText } from '../../../lib/form-errors';
import { useSetChannelSettings } from '../api/channel-settings.api';

/** Which prior seasons the district's channel leaves out as epidemic years (per district and disease). */
export function EpidemicYearsForm({ data }: { data: SignalsResponse }) {
  const { t } = useTranslation('cases');
  const save = useSetChannelSettings();
  const [years, setYears] = useState(data.excludedYears.map(String));
  const [message, setMessage] = useState<{ kind: 'success' | 'error'; text: string } | null>(null);
  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    try {
      const result = await save.mutateAsync({ districtId: data.district.id, body: { diseaseId: data.disease.id, excludedYears: years.map(Number) } });
      setMessage({
        kind: 'success',
        text: result.excludedYears.length ? t('epidemicYears.leftOut', { years: result.excludedYears.join(', ') }) : t('epidemicYears.allCount'),
      });
    } catch (error) {
      setMessage({ kind: 'error', text: formErrorText(error) });
    }
  };
  return (
    <form onSubmit={onSubmit} className="card space-y-2" aria-labelledby="epidemic-years-title">
      <h2 id="epidemic-years-title" className="section-title">
        {t('epidemicYears.title')}
      </h2>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <CheckboxGroup
        legend={t('epidemicYears.legend', { disease: data.disease.name })}
        hint={t('epidemicYears.hint')}
        options={data.priorSeasons.map((s) => ({ value: String(s.year), label: String(s.year) }))}
        value={years}
        onChange={setYears}
        emptyText={t('epidemicYears.empty')}
      />
      <button type="submit" className="btn btn-secondary btn-small" disabled={save.isPending}>
        {t('epidemicYears.save')}
      </button>
    </form>
  );
}
