import { expect, it } from 'vitest';
import { escapeHtml } from '@/lib/server/html';

it('escapes the five characters HTML gives meaning to, and nothing else', () => {
  expect(escapeHtml(`<a href="x">'&'</a> ⚡`)).toBe('&#60;a href=&#34;x&#34;&#62;&#39;&#38;&#39;&#60;/a&#62; ⚡');
});
