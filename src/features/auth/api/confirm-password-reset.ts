import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const confirmPasswordReset = (input: { token: string; password: string }) =>
  api.post<{ user: { email: string } }>('/api/auth/password-reset/confirm', input);

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
