/** Where to send someone after signing in: only ever a path on this site. */

/**
 * Resolves `raw` against `origin` the way a browser would (backslashes, tabs and newlines,
 * encoded slashes after decoding, scheme-relative `//host`) and keeps it only when it stays on
 * `origin`. The answer is a path starting with exactly one slash, or "/" when `raw` leaves the site.
 */
export function sameOriginPath(raw: string | null | undefined, origin: string): string {
  if (!raw) return '/';
  let resolved: URL;
  try {
    resolved = new URL(raw, origin);
  } catch {
    return '/';
  }
  if (resolved.origin !== origin) return '/';
  // "/.//evil.test" resolves to the path "//evil.test", which a browser reads as another host.
  const path = `/${resolved.pathname.replace(/^[/\\]+/, '')}${resolved.search}${resolved.hash}`;
  return path;
}
