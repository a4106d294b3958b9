import { useId } from 'react';
import { useTranslation } from 'react-i18next';
import en from '../../i18n/locales/en/cautions.json';

/** The cautions, one key each, in the order shown (`cautions:lines.<key>`). */
const CAUTION_KEYS = ['estimate', 'limits', 'authority', 'vectorControl', 'clinical'] as const;

/**
 * Broodcast's cautions, in its own words (docs/product.md § Cautions), in English; the panel shows them in the
 * interface language from the `cautions` namespace. Shown on the Ladder, every District file and the
 * other screens that show estimates. Keep the wording there only, so every screen says the same thing.
 */
export const CAUTIONS: readonly string[] = CAUTION_KEYS.map((k) => en.lines[k]);

export function CautionsPanel({ className }: { className?: string }) {
  const headingId = useId();
  const { t } = useTranslation('cautions');
  return (
    <aside aria-labelledby={headingId} className={`cautions ${className ?? ''}`}>
      <h2 id={headingId} className="text-base font-bold text-accent-900">
        {t('heading')}
      </h2>
      <ul className="mt-2 list-disc space-y-1.5 pl-5 text-sm leading-relaxed">
        {CAUTION_KEYS.map((k) => (
          <li key={k}>{t(`lines.${k}`)}</li>
        ))}
      </ul>
    </aside>
  );
}
