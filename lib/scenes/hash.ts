import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';

/**
 * Content hash of a scene spec: SHA-256 of its RFC 8785 (JSON Canonicalization
 * Scheme) serialisation, so key order never changes the hash.
 */
export function contentHash(spec: unknown): string {
  const canonical = canonicalize(spec);
  if (canonical === undefined) throw new TypeError('spec cannot be serialised as JSON');
  return createHash('sha256').update(canonical).digest('hex');
}
