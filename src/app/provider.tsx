import { useEffect, type ReactNode } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { queryClient } from '@/lib/query-client';
import { setUnauthorizedHandler } from '@/lib/api-client';
import { authKeys } from '@/features/auth/api/keys';

export function AppProvider({ children }: { children: ReactNode }) {
  useEffect(() => {
    // A 401 anywhere means the session ended: forget the user so guarded pages send them to sign in.
    setUnauthorizedHandler(() => queryClient.setQueryData(authKeys.me(), null));
  }, []);
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
