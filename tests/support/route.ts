type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

export type CallOptions = {
  params?: Record<string, string>;
  body?: unknown;
  /** Sent as-is, for malformed-body tests. */
  rawBody?: string;
  headers?: Record<string, string>;
  cookie?: string;
  query?: Record<string, string>;
};

/** Calls a route handler directly with a real Request, as Next would. */
export async function callRoute(handler: Handler, method: string, path: string, options: CallOptions = {}) {
  const url = new URL(path, 'http://localhost:3000');
  for (const [k, v] of Object.entries(options.query ?? {})) url.searchParams.set(k, v);
  const headers: Record<string, string> = { ...(options.headers ?? {}) };
  if (options.cookie) headers.cookie = options.cookie;
  let body: string | undefined;
  if (options.rawBody !== undefined) body = options.rawBody;
  else if (options.body !== undefined) {
    body = JSON.stringify(options.body);
    headers['content-type'] ??= 'application/json';
  }
  if (body !== undefined) headers['content-length'] = String(Buffer.byteLength(body));
  const response = await handler(new Request(url, { method, headers, body }), { params: Promise.resolve(options.params ?? {}) });
  const text = await response.text();
  let json: Record<string, unknown> | null = null;
  try { json = text ? JSON.parse(text) : null; } catch { json = null; }
  return { status: response.status, json, contentType: response.headers.get('content-type') };
}
