import { useMutation } from '@tanstack/react-query';
import type { PasswordResetConfirmBody } from '../../../../shared/api/auth.schema';
import { api } from '../../../lib/api-client';

/** POST /api/auth/password-reset/confirm — 204; 400 with field errors, or code `token_invalid`. */
export const confirmPasswordReset = (body: PasswordResetConfirmBody) =>
  api.post('/api/auth/password-reset/confirm', body);

export const useConfirmPasswordReset = () => useMutation({ mutationFn: confirmPasswordReset });
