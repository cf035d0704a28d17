import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';

/** SHA-256 of a value's canonical JSON (RFC 8785): the same content always gives the same hash. */
export function contentHash(content: unknown): string {
  return createHash('sha256').update(canonicalize(content) ?? '').digest('hex');
}
