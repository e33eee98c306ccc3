import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DriveProgress } from '@shared/schemas/pledge';

export const driveProgressKeys = { all: ['drive-progress'] as const };

/** Per-recipient counts and blankets per status, counted by the server for the staff home page. */
export const getDriveProgress = () => api.get<{ progress: DriveProgress }>('/api/drive/progress').then((r) => r.progress);
export const driveProgressQueryOptions = () => queryOptions({ queryKey: driveProgressKeys.all, queryFn: getDriveProgress });
export function useDriveProgress() {
  return useQuery(driveProgressQueryOptions());
}
