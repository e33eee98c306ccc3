import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api-client';
import type { User } from '@shared/schemas/user';
import { authKeys } from './keys';

/** The signed-in user, or null when nobody is: a 401 here is an answer, not an error. */
export async function getMe(): Promise<User | null> {
  try {
    const { user } = await api.get<{ user: User }>('/api/auth/me');
    return user;
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: 5 * 60_000 });

export function useMe() {
  return useQuery(meQueryOptions());
}
