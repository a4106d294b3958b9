import { useEffect, useState } from 'react';
import { Trans, useTranslation } from 'react-i18next';
import { Link } from 'react-router-dom';
import type { PreferencesDto } from '../../../shared/api/users.schema';
import { useSession } from '../../app/session';
import { FormMessage, SelectField } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useFormat } from '../../i18n/format';
import { LANGUAGES, LANGUAGE_NAMES } from '../../../shared/languages';
import { isApiError } from '../../lib/api-client';
import { errorText } from '../../lib/error-text';
import { useUnits } from '../../lib/units';
import { useUpdatePreferences } from './api/update-preferences.api';

/** A warm day and a wet one, to show what the chosen units look like. */
const SAMPLE_C = 30;
const SAMPLE_MM = 12.7;

/** The signed-in user's own language and display units (every role). */
export function SettingsPage() {
  const { t } = useTranslation('settings');
  const me = useSession();
  const units = useUnits();
  const f = useFormat();
  const save = useUpdatePreferences();
  const [choice, setChoice] = useState<PreferencesDto>(me.preferences);
  useEffect(() => setChoice(me.preferences), [me.preferences]);
  const changed = (Object.keys(choice) as (keyof PreferencesDto)[]).filter((k) => choice[k] !== me.preferences[k]);

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('lead')}>{t('title')}</PageHeading>
      <form
        className="card max-w-xl space-y-4"
        onSubmit={(e) => {
          e.preventDefault();
          if (changed.length) save.mutate(Object.fromEntries(changed.map((k) => [k, choice[k]])));
        }}
      >
        <FormMessage kind="error">{save.isError ? errorText(save.error) : null}</FormMessage>
        <FormMessage kind="success">{save.isSuccess && changed.length === 0 ? t('saved') : null}</FormMessage>
        <SelectField
          label={t('language')}
          hint={t('languageHint')}
          value={choice.language}
          error={isApiError(save.error) ? save.error.fieldMessage('language') : undefined}
          onChange={(e) => setChoice({ ...choice, language: e.currentTarget.value as PreferencesDto['language'] })}
        >
          {LANGUAGES.map((l) => (
            <option key={l} value={l} lang={l}>
              {LANGUAGE_NAMES[l]}
            </option>
          ))}
        </SelectField>
        <SelectField
          label={t('temperature')}
          hint={t('temperatureHint')}
          value={choice.temperatureUnit}
          onChange={(e) => setChoice({ ...choice, temperatureUnit: e.currentTarget.value as PreferencesDto['temperatureUnit'] })}
        >
          <option value="C">{t('common:units.celsius')}</option>
          <option value="F">{t('common:units.fahrenheit')}</option>
        </SelectField>
        <SelectField
          label={t('rain')}
          hint={t('rainHint')}
          value={choice.rainUnit}
          onChange={(e) => setChoice({ ...choice, rainUnit: e.currentTarget.value as PreferencesDto['rainUnit'] })}
        >
          <option value="mm">{t('common:units.millimetres')}</option>
          <option value="in">{t('common:units.inches')}</option>
        </SelectField>
        <p data-testid="units-sample" className="text-sm text-ink-muted">
          {t('sample', {
            temperature: `${f.number(units.toTemperature(SAMPLE_C), 1)} ${units.temperatureSymbol}`,
            rain: `${f.number(units.toRain(SAMPLE_MM), units.rainDigits)} ${units.rainSymbol}`,
          })}
        </p>
        <button type="submit" className="btn btn-primary" disabled={save.isPending || changed.length === 0}>
          {save.isPending ? t('saving') : t('save')}
        </button>
      </form>
      <p className="mt-4 max-w-prose text-sm">
        <Trans t={t} i18nKey="mailLink" components={{ link: <Link className="link" to="/preferences" /> }} />
      </p>
    </section>
  );
}
