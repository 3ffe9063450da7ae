/** Security headers on every answer; the CSP of pages allows no inline script it has not hashed. */
import type { ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort, startServer } from '../../scripts/lib.mjs';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, PASSWORD } from '../helpers/factories';

let lead: Client;
beforeAll(async () => {
  const team = await makeTeam();
  lead = await signedIn(team.lead.email, PASSWORD);
});
afterAll(closeTestDb);

function directives(csp: string | null): Map<string, string[]> {
  return new Map((csp ?? '').split(';').map((d) => d.trim().split(/\s+/)).filter((p) => p[0]).map(([name, ...values]) => [name, values]));
}

describe('security headers', () => {
  it('pages carry a CSP without inline scripts, and the other headers', async () => {
    for (const [client, path] of [[new Client(), '/login'], [lead, '/plans'], [lead, '/']] as const) {
      const r = await client.get(path);
      expect(r.status, path).toBe(200);
      const csp = directives(r.headers.get('content-security-policy'));
      expect(csp.get('script-src'), path).toBeDefined();
      expect(csp.get('script-src'), path).not.toContain("'unsafe-inline'");
      expect(csp.get('script-src'), path).not.toContain("'unsafe-eval'");
      expect(csp.get('frame-ancestors'), path).toEqual(["'none'"]);
      expect(csp.get('object-src'), path).toEqual(["'none'"]);
      expect(r.headers.get('x-content-type-options'), path).toBe('nosniff');
      expect(r.headers.get('referrer-policy'), path).toBe('same-origin');
      expect(r.headers.get('permissions-policy'), path).toMatch(/camera=\(\)/);
      expect(r.headers.get('strict-transport-security'), path).toBeNull(); // served over http
      expect(r.headers.get('x-request-id'), path).toMatch(/^[0-9a-f-]{36}$/);
    }
  });

  it('every signed-in page is no-store, and so is every API answer', async () => {
    for (const path of ['/', '/plans', '/library', '/review']) {
      expect((await lead.get(path)).headers.get('cache-control'), path).toBe('no-store');
    }
    expect((await lead.get('/api/me')).headers.get('cache-control')).toBe('no-store');
    expect((await new Client().get('/api/health')).headers.get('x-content-type-options')).toBe('nosniff');
  });

  it('every inline script of a page is hashed into its policy', async () => {
    const { createHash } = await import('node:crypto');
    const r = await lead.get('/plans');
    const policy = r.headers.get('content-security-policy')!;
    for (const m of r.text.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)) {
      if (/\bsrc=/.test(m[1])) continue;
      expect(policy).toContain(`'sha256-${createHash('sha256').update(m[2]).digest('base64')}'`);
    }
  });

  it('sends HSTS when the public address is https', async () => {
    const env = Object.fromEntries(Object.entries(process.env).filter(([k]) => k.startsWith('BONDMAP_DB_'))) as Record<string, string>;
    const port = await freePort();
    const second = (await startServer({ port, env: { ...env, BONDMAP_PUBLIC_URL: 'https://bondmap.example.test', BONDMAP_LOG_LEVEL: 'error' }, stdio: 'ignore' })) as { child: ChildProcess; url: string };
    try {
      const r = await new Client(second.url).get('/login');
      expect(r.headers.get('strict-transport-security')).toMatch(/max-age=\d{7,}/);
    } finally {
      second.child.kill('SIGTERM');
    }
  });
});
