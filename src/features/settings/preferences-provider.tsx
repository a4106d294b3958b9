import { useEffect, useMemo, type ReactNode } from 'react';
import type { Me } from '../../../shared/api/auth.schema';
import { setLanguage } from '../../i18n';
import { UnitsContext, unitsFor } from '../../lib/units';

/**
 * Applies the signed-in user's own settings inside the signed-in layout: the interface language (their
 * account's, on every device) and the display units every screen reads with useUnits().
 */
export function PreferencesProvider({ me, children }: { me: Me; children: ReactNode }) {
  const { language, temperatureUnit, rainUnit } = me.preferences;
  useEffect(() => {
    void setLanguage(language);
  }, [language]);
  const units = useMemo(() => unitsFor({ temperature: temperatureUnit, rain: rainUnit }), [temperatureUnit, rainUnit]);
  return <UnitsContext value={units}>{children}</UnitsContext>;
}
