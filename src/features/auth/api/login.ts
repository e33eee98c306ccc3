import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, forgetCsrfToken } from '@/lib/api-client';
import type { User } from '@shared/schemas/user';
import { authKeys } from './keys';

export async function login(input: { email: string; password: string }) {
  const { user } = await api.post<{ user: User }>('/api/auth/login', input);
  forgetCsrfToken();
  return user;
}

export function useLogin() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (user) => {
      qc.clear();
      qc.setQueryData(authKeys.me(), user);
    },
  });
}
