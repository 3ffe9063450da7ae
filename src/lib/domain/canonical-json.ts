/**
 * JSON with object keys sorted at every level, so that two equal documents give the same text
 * (and the same hash) whatever order their keys were written in.
 */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(sortKeys(value));
}

function sortKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(sortKeys);
  if (value && typeof value === 'object') {
    return Object.fromEntries(
      Object.keys(value as Record<string, unknown>)
        .sort()
        .filter((key) => (value as Record<string, unknown>)[key] !== undefined)
        .map((key) => [key, sortKeys((value as Record<string, unknown>)[key])]),
    );
  }
  return value;
}

/** A hash function over text (hex digest); the domain takes it from outside and never imports one. */
export type TextHash = (text: string) => string;

/**
 * The fingerprint an approval records for its document and report: the given hash (SHA-256 in the
 * app, see src/lib/server/fingerprint.ts) of the canonical JSON.
 */
export function canonicalHash(value: unknown, hash: TextHash): string {
  return hash(canonicalJson(value));
}
