import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** POST /api/auth/password-reset — always 202, whether or not the account exists. */
export const requestPasswordReset = (body: { email: string }) => api.post('/api/auth/password-reset', body);

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
