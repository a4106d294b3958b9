import { useMutation } from '@tanstack/react-query';
import type { PasswordResetConfirmBody } from '../../../../shared/api/auth.schema';
import { api } from '../../../lib/api-client';

/** POST /api/auth/invite/accept — 204; the same errors as the password-reset confirmation. */
export const acceptInvite = (body: PasswordResetConfirmBody) => api.post('/api/auth/invite/accept', body);

export const useAcceptInvite = () => useMutation({ mutationFn: acceptInvite });
