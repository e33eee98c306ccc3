import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '@/lib/api-client';

/** The server's issues by field name (first message wins), for showing beside each control. */
export function serverFieldErrors(err: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  if (err instanceof ApiError) for (const i of err.issues) if (i.path && !out[i.path]) out[i.path] = i.message;
  return out;
}

/**
 * Puts the server's field errors onto a react-hook-form form, renaming fields where the form
 * holds a value differently (a width typed in inches is `widthCm` to the server). Returns the
 * issues it could not place, so the page can show them above the form.
 */
export function applyServerErrors<T extends FieldValues>(
  err: unknown,
  setError: UseFormSetError<T>,
  known: readonly string[],
  rename: Record<string, string> = {},
): string[] {
  const unplaced: string[] = [];
  for (const [path, message] of Object.entries(serverFieldErrors(err))) {
    const field = rename[path] ?? path.split('.')[0]!;
    if (known.includes(field)) setError(field as Path<T>, { type: 'server', message });
    else unplaced.push(message);
  }
  return unplaced;
}
