// The JSON API as the upload pages call it: one shape for success and for the API's errors
// (`{ error: { code, message, details } }`; 422 details are `{ path, message }[]`).

export type FieldIssue = { path: string; message: string };
export type ApiFailure = { status: number; code: string; message: string; details: FieldIssue[] };
export type ApiResult<T> = { ok: true; data: T } | { ok: false; error: ApiFailure };

export function failureOf(status: number, body: unknown): ApiFailure {
  const error = (body as { error?: { code?: string; message?: string; details?: unknown } } | null)?.error;
  return {
    status,
    code: error?.code ?? 'error',
    message: error?.message ?? (status === 0 ? 'The server could not be reached. Check the connection and try again.' : `The server answered ${status}.`),
    details: Array.isArray(error?.details) ? (error.details as FieldIssue[]) : [],
  };
}

export async function callApi<T>(url: string, init: { method?: string; body?: unknown; signal?: AbortSignal } = {}): Promise<ApiResult<T>> {
  let res: Response;
  try {
    res = await fetch(url, {
      method: init.method ?? 'GET',
      headers: init.body === undefined ? undefined : { 'content-type': 'application/json' },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      signal: init.signal,
      cache: 'no-store',
    });
  } catch (err) {
    if ((err as Error).name === 'AbortError') throw err;
    return { ok: false, error: failureOf(0, null) };
  }
  const text = await res.text();
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = null;
  }
  return res.ok ? { ok: true, data: body as T } : { ok: false, error: failureOf(res.status, body) };
}

export const fingerprintSegment = (fingerprint: string) => encodeURIComponent(fingerprint);

export const uploadPath = (siteId: number, uploadId: number) => `/sites/${siteId}/uploads/${uploadId}`;
export const wizardPath = (siteId: number, uploadId: number, fingerprint: string, step: string) =>
  `${uploadPath(siteId, uploadId)}/map/${fingerprintSegment(fingerprint)}/${step}`;

export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} kB`;
  return `${(n / 1024 / 1024).toFixed(1)} MB`;
}

/** A moment in the given zone (the site's, for readings), else the browser's. */
export function formatWhen(iso: string | null, timeZone?: string): string {
  if (!iso) return '—';
  return new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short', ...(timeZone ? { timeZone } : {}) });
}
