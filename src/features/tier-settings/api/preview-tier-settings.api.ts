import { useMutation } from '@tanstack/react-query';
import { tierSettingsPreviewResponse, type TierSettingsPreviewBody } from '../../../../shared/api/tier-settings.schema';
import { api } from '../../../lib/api-client';

/** POST /api/tier-settings/preview (admin) — how this week's Ladder would change; writes nothing. */
export const usePreviewTierSettings = () =>
  useMutation({ mutationFn: (body: TierSettingsPreviewBody) => api.post('/api/tier-settings/preview', body, tierSettingsPreviewResponse) });
