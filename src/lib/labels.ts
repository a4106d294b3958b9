import { useCallback } from 'react';
import { useTranslation } from 'react-i18next';
import type { Role } from '../../shared/roles';

/**
 * The one place role names are translated (`app:roles.<id>`). shared/roles.ts keeps the English
 * labels for the server; every screen shows these.
 */
export function useRoleLabel(): (role: Role) => string {
  const { t } = useTranslation('app');
  return useCallback((role: Role) => t(`roles.${role}`), [t]);
}
