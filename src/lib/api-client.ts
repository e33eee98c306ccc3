/** The one way the client talks to the API: JSON in and out, CSRF handled here, typed errors thrown. */
export interface ApiIssue {
  path: string;
  message: string;
}

export class ApiError extends Error {
  constructor(
    public readonly status: number,
    message: string,
    public readonly issues: ApiIssue[] = [],
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

let csrfToken: string | null = null;
let onUnauthorized: (() => void) | null = null;

/** The app registers what happens on a 401 (drop the cached user); pages never handle it themselves. */
export function setUnauthorizedHandler(fn: () => void) {
  onUnauthorized = fn;
}

async function token(): Promise<string> {
  if (csrfToken) return csrfToken;
  const res = await fetch('/api/auth/csrf', { credentials: 'same-origin' });
  const body = (await res.json()) as { csrfToken: string };
  csrfToken = body.csrfToken;
  return csrfToken;
}

/** Sign-in, sign-out and registration replace the session, and the token with it. */
export function forgetCsrfToken() {
  csrfToken = null;
}

async function toError(res: Response): Promise<ApiError> {
  let message = `Request failed (${res.status})`;
  let issues: ApiIssue[] = [];
  try {
    const body = (await res.json()) as { error?: { message?: string; issues?: ApiIssue[] } };
    if (body.error?.message) message = body.error.message;
    issues = body.error?.issues ?? [];
  } catch {
    /* not JSON: keep the generic message */
  }
  return new ApiError(res.status, message, issues);
}

async function request<T>(method: string, url: string, body?: unknown, retried = false): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (method !== 'GET') headers['X-CSRF-Token'] = await token();
  if (body !== undefined) headers['Content-Type'] = 'application/json';
  const res = await fetch(url, {
    method,
    headers,
    credentials: 'same-origin',
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (res.status === 403 && method !== 'GET' && !retried) {
    // A stale token (the session was renewed elsewhere): fetch a fresh one once and retry.
    const err = await toError(res.clone());
    if (/security token/i.test(err.message)) {
      forgetCsrfToken();
      return request<T>(method, url, body, true);
    }
  }
  if (!res.ok) {
    const err = await toError(res);
    if (res.status === 401 && !url.startsWith('/api/auth/')) onUnauthorized?.();
    throw err;
  }
  if (res.status === 204) return undefined as T;
  const type = res.headers.get('content-type') ?? '';
  return (type.includes('json') ? await res.json() : await res.text()) as T;
}

/** Multipart upload with real progress events (fetch has none for uploads). */
function upload<T>(url: string, form: FormData, onProgress?: (fraction: number) => void): Promise<T> {
  return token().then(
    (t) =>
      new Promise<T>((resolve, reject) => {
        const xhr = new XMLHttpRequest();
        xhr.open('POST', url);
        xhr.setRequestHeader('X-CSRF-Token', t);
        xhr.setRequestHeader('Accept', 'application/json');
        xhr.upload.onprogress = (e) => {
          if (e.lengthComputable) onProgress?.(e.loaded / e.total);
        };
        xhr.onload = () => {
          let body: { error?: { message?: string; issues?: ApiIssue[] } } | undefined;
          try {
            body = JSON.parse(xhr.responseText);
          } catch {
            body = undefined;
          }
          if (xhr.status >= 200 && xhr.status < 300) {
            onProgress?.(1);
            resolve(body as T);
          } else {
            reject(new ApiError(xhr.status, body?.error?.message ?? `Upload failed (${xhr.status})`, body?.error?.issues ?? []));
          }
        };
        xhr.onerror = () => reject(new ApiError(0, 'The upload was interrupted; check your connection and try again'));
        xhr.send(form);
      }),
  );
}

export const api = {
  get: <T>(url: string) => request<T>('GET', url),
  post: <T>(url: string, body?: unknown) => request<T>('POST', url, body ?? {}),
  put: <T>(url: string, body?: unknown) => request<T>('PUT', url, body ?? {}),
  patch: <T>(url: string, body?: unknown) => request<T>('PATCH', url, body ?? {}),
  delete: <T>(url: string, body?: unknown) => request<T>('DELETE', url, body),
  upload,
};

/** Builds a query string from defined values only. */
export function qs(params: Record<string, string | number | boolean | null | undefined>): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '') p.set(k, String(v));
  const s = p.toString();
  return s ? `?${s}` : '';
}
