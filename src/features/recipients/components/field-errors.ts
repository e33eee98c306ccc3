import { ApiError } from '@/lib/api-client';

/** The server's issues by field name (first message wins), for showing beside each control. */
export function fieldErrors(err: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  if (err instanceof ApiError) for (const i of err.issues) if (i.path && !out[i.path]) out[i.path] = i.message;
  return out;
}

/** zod issues from a local safeParse in the same shape. */
export function zodErrors(issues: ReadonlyArray<{ path: PropertyKey[]; message: string }>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const i of issues) {
    const key = i.path.map(String).join('.');
    if (!out[key]) out[key] = i.message;
  }
  return out;
}
