import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, forgetCsrfToken } from '@/lib/api-client';
import { authKeys } from './keys';

export async function logout() {
  await api.post<void>('/api/auth/logout');
  forgetCsrfToken();
}

export function useLogout() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onSuccess: () => {
      qc.clear();
      qc.setQueryData(authKeys.me(), null);
    },
  });
}
