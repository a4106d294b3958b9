import { useTranslation } from 'react-i18next';
import { PHONE_QUERY, useMediaQuery } from '../../lib/use-media-query';
import { CautionsPanel } from './cautions-panel';

/**
 * The cautions on a screen whose work should come first on a phone (the Ladder for an officer, supervisor,
 * epidemiologist or admin): on a wide screen the whole panel; on a phone (below 40rem) a closed disclosure
 * whose summary already says, in one line, that Broodcast estimates and defers to the health authority, with
 * the full cautions one tap away. The community worker's first screen does the same (ladder/worker-home.tsx).
 * Advisories keep the whole panel always shown.
 */
export function CautionsDisclosure({ className }: { className?: string }) {
  const { t } = useTranslation('cautions');
  const phone = useMediaQuery(PHONE_QUERY);
  if (!phone) return <CautionsPanel className={className} />;
  return (
    <details className={`card cautions-disclosure !py-3 ${className ?? ''}`} data-testid="cautions-disclosure">
      <summary className="cursor-pointer py-1">
        <span className="font-bold text-accent-900">{t('heading')}</span>
        <span className="mt-0.5 block text-sm">{t('short')}</span>
      </summary>
      <CautionsPanel className="mt-3" />
    </details>
  );
}
