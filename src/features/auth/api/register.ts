import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, forgetCsrfToken } from '@/lib/api-client';
import type { User } from '@shared/schemas/user';
import { authKeys } from './keys';

export async function register(input: { name: string; email: string; password: string }) {
  const { user } = await api.post<{ user: User }>('/api/auth/register', input);
  forgetCsrfToken();
  return user;
}

export function useRegister() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: register,
    onSuccess: (user) => {
      qc.clear();
      qc.setQueryData(authKeys.me(), user);
    },
  });
}
