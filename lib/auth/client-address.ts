/**
 * The client's address for rate limiting: the first X-Forwarded-For hop when a
 * proxy sets it, else X-Real-IP, else "local".
 */
export function clientAddress(headers: Record<string, string | string[] | undefined> | Headers): string {
  const get = (name: string): string | undefined => {
    if (headers instanceof Headers) return headers.get(name) ?? undefined;
    const value = headers[name];
    return Array.isArray(value) ? value[0] : value;
  };
  const forwarded = get('x-forwarded-for')?.split(',')[0]?.trim();
  return forwarded || get('x-real-ip')?.trim() || 'local';
}
