import { useId } from 'react';
import { useTranslation } from 'react-i18next';
import { setLanguage } from '../i18n';
import { LANGUAGES, LANGUAGE_NAMES, isLanguage } from '../../shared/languages';

/**
 * The interface language, chosen before sign-in (and remembered on this device by `setLanguage`).
 * Each language is named in itself, marked with its `lang`, so a screen reader says it right.
 */
export function LanguagePicker({ className }: { className?: string }) {
  const id = useId();
  const { t, i18n } = useTranslation('components');
  const current = i18n.resolvedLanguage ?? i18n.language;
  return (
    <div className={className ?? 'flex items-center gap-2 text-sm'}>
      <label htmlFor={id} className="font-bold">
        {t('common:language')}
      </label>
      <select
        id={id}
        className="input w-auto"
        value={isLanguage(current) ? current : 'en'}
        onChange={(e) => {
          const next = e.currentTarget.value;
          if (isLanguage(next)) void setLanguage(next);
        }}
      >
        {LANGUAGES.map((l) => (
          <option key={l} value={l} lang={l}>
            {LANGUAGE_NAMES[l]}
          </option>
        ))}
      </select>
    </div>
  );
}
