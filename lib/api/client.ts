/** A failed API call, carrying the problem+json detail and per-field errors. */
export class ApiError extends Error {
  constructor(readonly status: number, message: string, readonly fieldErrors: { field: string; message: string }[] = []) {
    super(message);
  }
}

/** fetch for the browser: JSON in and out; throws ApiError with the server's message. */
export async function apiFetch<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  const response = await fetch(url, {
    method: init.method ?? 'GET',
    headers: init.body === undefined ? undefined : { 'content-type': 'application/json' },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
  if (response.status === 204) return undefined as T;
  const data = await response.json().catch(() => ({}));
  if (!response.ok) throw new ApiError(response.status, data.detail ?? `Request failed (${response.status}).`, data.errors ?? []);
  return data as T;
}
