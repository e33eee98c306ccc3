import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PhotoView } from '@shared/schemas/blanket-log';
import { blanketKeys } from './keys';

export interface UploadPhotosInput {
  blanketId: number;
  files: File[];
  /** 0..1 as the bytes leave the browser. */
  onProgress?: (fraction: number) => void;
}

export function uploadPhotos({ blanketId, files, onProgress }: UploadPhotosInput) {
  const form = new FormData();
  for (const f of files) form.append('photos', f);
  return api.upload<{ photos: PhotoView[] }>(`/api/blankets/${blanketId}/photos`, form, onProgress).then((r) => r.photos);
}

export function useUploadPhotos() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: uploadPhotos,
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: blanketKeys.all });
    },
  });
}
