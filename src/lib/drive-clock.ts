import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { DriveClockView } from '@shared/schemas/schedule';
import { api } from './api-client';

/**
 * The drive's clock: its IANA zone and its date today, as the server reads them. Every "today" and
 * every time on a page comes from here, never from the browser's own zone.
 */
export const driveClockKeys = { all: ['drive', 'clock'] as const };

export const getDriveClock = () => api.get<DriveClockView>('/api/drive/clock');
// A minute's staleness at most, so a page left open over midnight moves to the new day.
export const driveClockQueryOptions = () => queryOptions({ queryKey: driveClockKeys.all, queryFn: getDriveClock, staleTime: 60_000, refetchInterval: 60_000 });
export function useDriveClock() {
  return useQuery(driveClockQueryOptions());
}

/** The drive's today, YYYY-MM-DD; until the server answers, the browser's own date stands in. */
export function useDriveToday(): string {
  const clock = useDriveClock();
  return clock.data?.today ?? browserToday();
}

const browserToday = () => new Intl.DateTimeFormat('en-CA').format(new Date());

export const setDriveZone = (timeZone: string) => api.put<DriveClockView>('/api/drive/clock', { timeZone });
export function useSetDriveZone() {
  const qc = useQueryClient();
  // Every time and "today" on every page follows the zone, so everything is read again.
  return useMutation({ mutationFn: setDriveZone, onSuccess: () => qc.invalidateQueries() });
}
