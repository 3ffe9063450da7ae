import { createHash } from 'node:crypto';
import { canonicalHash } from '@/lib/domain/canonical-json';

/** SHA-256 (hex) of a text. */
export function sha256Hex(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

/** SHA-256 of the canonical JSON of a value: the fingerprint an approval records. */
export function fingerprint(value: unknown): string {
  return canonicalHash(value, sha256Hex);
}
