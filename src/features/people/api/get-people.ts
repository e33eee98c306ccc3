import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Role } from '@shared/schemas/user';
import { peopleKeys } from './keys';

export interface Person {
  id: number;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  createdAt: string;
}

export const getPeople = () => api.get<{ users: Person[] }>('/api/users').then((r) => r.users);
export const peopleQueryOptions = () => queryOptions({ queryKey: peopleKeys.list(), queryFn: getPeople });
export function usePeople() {
  return useQuery(peopleQueryOptions());
}
