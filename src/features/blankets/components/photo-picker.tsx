import { useEffect, useId, useMemo, useState } from 'react';
import { ImagePlus, X } from 'lucide-react';
import { MAX_PHOTO_BYTES, MAX_PHOTOS_PER_BLANKET, PHOTO_MIME_TYPES } from '@shared/schemas/blanket-log-values';

const MB = 1024 * 1024;

/** What the browser can tell before sending; the server still checks the bytes themselves. */
export function photoProblems(files: File[], room: number): string[] {
  const problems: string[] = [];
  if (files.length > room) problems.push(`Choose at most ${room} photo${room === 1 ? '' : 's'}: a blanket has ${MAX_PHOTOS_PER_BLANKET} at most.`);
  for (const f of files) {
    if (f.size === 0) problems.push(`${f.name} is empty.`);
    else if (f.size > MAX_PHOTO_BYTES) problems.push(`${f.name} is ${(f.size / MB).toFixed(1)} MB; each photo may be ${MAX_PHOTO_BYTES / MB} MB at most.`);
    if (f.type && !(PHOTO_MIME_TYPES as readonly string[]).includes(f.type)) problems.push(`${f.name} is not a JPEG, PNG or WebP photo.`);
  }
  return problems;
}

/** Choose up to `room` photos, see them before sending, and take any back out. */
export function PhotoPicker({ files, onChange, room, error }: { files: File[]; onChange: (files: File[]) => void; room: number; error?: string }) {
  const id = useId();
  const [inputKey, setInputKey] = useState(0);
  const previews = useMemo(() => files.map((f) => ({ file: f, url: URL.createObjectURL(f) })), [files]);
  useEffect(() => () => previews.forEach((p) => URL.revokeObjectURL(p.url)), [previews]);
  const problems = [...photoProblems(files, room), ...(error ? [error] : [])];
  return (
    <div className="space-y-3">
      <label htmlFor={id} className="block font-bold">
        Add photos <span className="font-normal text-ink-soft">(up to {room}; JPEG, PNG or WebP, {MAX_PHOTO_BYTES / MB} MB each)</span>
      </label>
      <p className="text-sm text-ink-soft">A photo of the whole blanket and one close-up of the stitches help the organisers match it to a recipient.</p>
      <label
        htmlFor={id}
        className="flex min-h-11 cursor-pointer items-center justify-center gap-2 rounded-xl border-2 border-dashed border-heather-300 bg-heather-50 px-4 py-4 font-bold text-heather-800 hover:bg-heather-100"
      >
        <ImagePlus className="size-6" aria-hidden /> Choose photos
      </label>
      <input
        key={inputKey}
        id={id}
        type="file"
        multiple
        accept={PHOTO_MIME_TYPES.join(',')}
        className="sr-only"
        aria-describedby={problems.length ? `${id}-err` : undefined}
        onChange={(e) => {
          onChange([...files, ...Array.from(e.target.files ?? [])]);
          setInputKey((k) => k + 1);
        }}
      />
      {previews.length > 0 && (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          {previews.map((p, i) => (
            <li key={p.url} className="relative overflow-hidden rounded-xl border border-oat-200 bg-oat-50">
              <img src={p.url} alt={`Chosen photo ${i + 1}`} className="aspect-square w-full object-cover" />
              <p className="truncate px-2 py-1 text-xs">{p.file.name}</p>
              <button
                type="button"
                className="absolute right-1 top-1 rounded-full bg-white/90 p-1 shadow hover:bg-white"
                aria-label={`Remove ${p.file.name}`}
                onClick={() => onChange(files.filter((_, j) => j !== i))}
              >
                <X className="size-5" aria-hidden />
              </button>
            </li>
          ))}
        </ul>
      )}
      {problems.length > 0 && (
        <ul id={`${id}-err`} className="space-y-1 text-sm font-bold text-brick-700" role="alert">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
