import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DriveGlance } from '@shared/schemas/glance';

export const driveGlanceKeys = { all: ['drive-glance'] as const };

/** The whole drive for the coordinator and organisers, every figure counted by the server. */
export const getDriveGlance = () => api.get<{ glance: DriveGlance }>('/api/drive/glance').then((r) => r.glance);
export const driveGlanceQueryOptions = () => queryOptions({ queryKey: driveGlanceKeys.all, queryFn: getDriveGlance });
export function useDriveGlance() {
  return useQuery(driveGlanceQueryOptions());
}
