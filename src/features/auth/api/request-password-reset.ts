import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export const requestPasswordReset = (input: { email: string }) =>
  api.post<{ message: string }>('/api/auth/password-reset', input);

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
