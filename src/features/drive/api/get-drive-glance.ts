import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DriveGlance, GlanceWeek } from '@shared/schemas/glance';

export const driveGlanceKeys = {
  all: ['drive-glance'] as const,
  weeks: (needId: number) => [...driveGlanceKeys.all, 'weeks', needId] as const,
};

/** The whole drive for the coordinator and organisers, every figure counted by the server. */
export const getDriveGlance = () => api.get<{ glance: DriveGlance }>('/api/drive/glance').then((r) => r.glance);
export const driveGlanceQueryOptions = () => queryOptions({ queryKey: driveGlanceKeys.all, queryFn: getDriveGlance });
export function useDriveGlance() {
  return useQuery(driveGlanceQueryOptions());
}

/** The week-by-week figures of one need. */
export const getGlanceWeeks = (needId: number) => api.get<{ weeks: GlanceWeek[] }>(`/api/drive/glance/weeks?needId=${needId}`).then((r) => r.weeks);
export const glanceWeeksQueryOptions = (needId: number) => queryOptions({ queryKey: driveGlanceKeys.weeks(needId), queryFn: () => getGlanceWeeks(needId) });
export function useGlanceWeeks(needId: number | null) {
  return useQuery({ ...glanceWeeksQueryOptions(needId ?? 0), enabled: needId !== null });
}
