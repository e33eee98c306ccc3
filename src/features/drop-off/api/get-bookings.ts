import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BookingView } from '@shared/schemas/booking';
import { dropOffKeys } from './keys';

type Answer = { bookings: BookingView[]; timeZone: string };

export const getMyBookings = () => api.get<Answer>('/api/bookings');
export const myBookingsQueryOptions = () => queryOptions({ queryKey: dropOffKeys.mine(), queryFn: getMyBookings });
export function useMyBookings() {
  return useQuery(myBookingsQueryOptions());
}

export const getSiteDay = (siteId: number, day: string) => api.get<Answer>(`/api/bookings?siteId=${siteId}&day=${day}`);
export const siteDayQueryOptions = (siteId: number, day: string) => queryOptions({ queryKey: dropOffKeys.day(siteId, day), queryFn: () => getSiteDay(siteId, day) });
export function useSiteDay(siteId: number | null, day: string) {
  return useQuery({ ...siteDayQueryOptions(siteId ?? 0, day), enabled: siteId !== null });
}
