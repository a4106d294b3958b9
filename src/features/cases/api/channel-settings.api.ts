import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { ChannelSettingsBody } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

const answer = z.object({ districtId: z.string(), diseaseId: z.string(), excludedYears: z.array(z.number()) });

/** PUT /api/districts/:id/channel-settings (admin, epidemiologist of the district) — the epidemic years left out of the channel. */
export const setChannelSettings = ({ districtId, body }: { districtId: string; body: ChannelSettingsBody }) =>
  api.put(`/api/districts/${encodeURIComponent(districtId)}/channel-settings`, body, answer);

export function useSetChannelSettings() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: setChannelSettings, onSuccess: () => queryClient.invalidateQueries({ queryKey: casesKeys.all }) });
}
