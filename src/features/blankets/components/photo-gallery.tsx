import { useState } from 'react';
import { Trash2 } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/alert';
import { ProgressBar } from '@/components/ui/progress-bar';
import { MAX_PHOTOS_PER_BLANKET } from '@shared/schemas/blanket-log-values';
import type { BlanketDetail } from '@shared/schemas/blanket-log';
import { useUploadPhotos } from '../api/upload-photos';
import { useDeletePhoto } from '../api/delete-photo';
import { PhotoPicker, photoProblems } from './photo-picker';

/** The blanket's photos (thumbnails open the full photo); its maker can add more or take one away. */
export function PhotoGallery({ blanket, isMaker }: { blanket: BlanketDetail; isMaker: boolean }) {
  const upload = useUploadPhotos();
  const remove = useDeletePhoto();
  const [files, setFiles] = useState<File[]>([]);
  const [progress, setProgress] = useState<number | null>(null);
  const room = MAX_PHOTOS_PER_BLANKET - blanket.photos.length;
  const send = () => {
    if (files.length === 0 || photoProblems(files, room).length > 0) return;
    setProgress(0);
    upload.mutate(
      { blanketId: blanket.id, files, onProgress: setProgress },
      { onSuccess: () => setFiles([]), onSettled: () => setProgress(null) },
    );
  };
  return (
    <div className="space-y-4">
      {blanket.photos.length === 0 ? (
        <p className="text-ink-soft">No photos yet.</p>
      ) : (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4" data-testid="photo-gallery">
          {blanket.photos.map((p, i) => (
            <li key={p.id} className="relative">
              <a href={p.url} target="_blank" rel="noreferrer">
                <img src={p.thumbUrl} alt={`Photo ${i + 1} of ${blanket.code}`} className="aspect-square w-full rounded-xl object-cover" loading="lazy" />
              </a>
              {isMaker && (
                <button
                  type="button"
                  className="absolute right-1 top-1 rounded-full bg-white/90 p-1.5 shadow hover:bg-white"
                  aria-label={`Remove photo ${i + 1}`}
                  onClick={() => remove.mutate({ blanketId: blanket.id, photoId: p.id })}
                >
                  <Trash2 className="size-5 text-brick-700" aria-hidden />
                </button>
              )}
            </li>
          ))}
        </ul>
      )}
      {remove.error && <Alert kind="error">{remove.error.message}</Alert>}
      {isMaker && room > 0 && (
        <div className="space-y-3">
          <PhotoPicker files={files} onChange={setFiles} room={room} error={upload.error?.message} />
          {progress !== null && <ProgressBar value={progress} label="Sending photos" />}
          {files.length > 0 && (
            <Button onClick={send} busy={upload.isPending}>
              Add {files.length === 1 ? 'this photo' : `these ${files.length} photos`}
            </Button>
          )}
        </div>
      )}
    </div>
  );
}
