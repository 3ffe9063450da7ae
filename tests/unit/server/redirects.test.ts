import { describe, expect, it } from 'vitest';
import { sameOriginPath } from '@/lib/server/redirects';

const origin = 'http://127.0.0.1:4321';

// Each `next` as the browser hands it to the server after URL-decoding the query string.
const cases: Array<[string | null, string]> = [
  [null, '/'],
  ['', '/'],
  ['/plans/3?tab=review#c2', '/plans/3?tab=review#c2'],
  ['plans', '/plans'],
  ['/\\evil.test/phish', '/'],
  ['\\\\evil.test/phish', '/'],
  ['//evil.test/phish', '/'],
  ['/\t/evil.test/phish', '/'],
  ['\t//evil.test', '/'],
  ['/\n/evil.test', '/'],
  ['/\r\n/evil.test', '/'],
  ['https://evil.test/', '/'],
  ['http:evil.test', '/evil.test'],
  ['javascript:alert(1)', '/'],
  ['data:text/html,x', '/'],
  ['http://127.0.0.1:4321/plans', '/plans'],
  ['http://127.0.0.1:4322/plans', '/'],
  ['/.//evil.test/x', '/evil.test/x'],
  ['/%2F%2Fevil.test', '/%2F%2Fevil.test'],
  ['http://[::1', '/'],
];

describe('sameOriginPath', () => {
  it.each(cases)('%j → %s', (raw, expected) => {
    const result = sameOriginPath(raw, origin);
    expect(result).toBe(expected);
    // Whatever comes out, a browser resolving it stays on this origin.
    expect(new URL(result, origin).origin).toBe(origin);
  });
});
