/**
 * Form pages refuse what is not a form (415/400/413 pages, never a 500) and never read a body past
 * its limit; the sign-in redirect stays on this site.
 */
import { request as httpRequest } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, PASSWORD, planDocument } from '../helpers/factories';

const ORIGIN = new URL(BASE_URL).origin;
let team: Awaited<ReturnType<typeof makeTeam>>;
let clients: Record<'anonymous' | 'lead' | 'reviewer' | 'admin', Client>;
let planId: number;

beforeAll(async () => {
  team = await makeTeam();
  clients = {
    anonymous: new Client(),
    lead: await signedIn(team.lead.email, PASSWORD),
    reviewer: await signedIn(team.reviewer.email, PASSWORD),
    admin: await signedIn(team.admin.email, PASSWORD),
  };
  const created = await clients.lead.post('/api/plans', { title: 'Invented form-test pole', document: planDocument() });
  planId = created.body.plan.id;
});
afterAll(closeTestDb);

const formRoutes = (): Array<[string, keyof typeof clients]> => [
  ['/login', 'anonymous'],
  ['/forgot-password', 'anonymous'],
  ['/set-password/not-a-real-link-0123456789', 'anonymous'],
  ['/plans/new', 'lead'],
  [`/plans/${planId}/review`, 'reviewer'],
  [`/plans/${planId}/workflow`, 'lead'],
  ['/admin/users', 'admin'],
  ['/settings', 'admin'],
  ['/equipment', 'admin'],
  ['/equipment/settings', 'admin'],
  ['/records/start', 'lead'],
];

describe('form pages and bodies that are not forms', () => {
  it('answer JSON, text and XML bodies with a 415 page, and a damaged multipart body with a 400 page', async () => {
    for (const [path, who] of formRoutes()) {
      for (const [type, body] of [
        ['application/json', '{"email":"a@b.test","password":"x"}'],
        ['application/xml', '<a/>'],
      ]) {
        const r = await clients[who].request('POST', path, { body, headers: { 'content-type': type, origin: ORIGIN } });
        // The set-password page reads no body for a link that is not valid (400 either way).
        expect([415, 400], `${path} ${type}`).toContain(r.status);
        if (!path.startsWith('/set-password')) expect(r.status, `${path} ${type}`).toBe(415);
        expect(r.headers.get('content-type')).toMatch(/text\/html/);
      }
      const damaged = await clients[who].request('POST', path, { body: '--x\r\nnonsense', headers: { 'content-type': 'multipart/form-data; boundary=zz', origin: ORIGIN } });
      expect(damaged.status, `${path} multipart`).toBeLessThan(500);
      if (!path.startsWith('/set-password')) expect(damaged.status, `${path} multipart`).toBe(400);
    }
  });

  it('refuse a form body over 64 KiB with a 413 page', async () => {
    for (const [path, who] of formRoutes()) {
      // The grounding-set page's form carries a CSV import, so it takes 2 MiB like the import API.
      if (path.startsWith('/set-password') || path === '/equipment') continue;
      const body = new URLSearchParams({ email: 'a@b.test', password: 'x', title: 'x'.repeat(70 * 1024) }).toString();
      const r = await clients[who].request('POST', path, { body, headers: { 'content-type': 'application/x-www-form-urlencoded', origin: ORIGIN } });
      expect(r.status, path).toBe(413);
    }
  });

  it('stop reading a body without Content-Length once it streams past the limit', async () => {
    for (const path of ['/login', '/api/auth/login']) {
      const type = path.startsWith('/api') ? 'application/json' : 'application/x-www-form-urlencoded';
      const { status, sent } = await streamUntilAnswered(path, type, 64 * 1024 * 1024);
      // 413, or — when the server's close with the body still arriving turns into a TCP reset that
      // overtakes the answer — a reset connection (0). Either way it stopped reading; a server that
      // kept reading or just stalled would time out here.
      expect([413, 0], path).toContain(status);
      expect(sent, path).toBeLessThan(16 * 1024 * 1024); // far from the 64 MB on offer
    }
  });

  it('answer a declared oversized body at once, before any of it arrives', async () => {
    const status = await new Promise<number>((resolve, reject) => {
      const url = new URL('/login', BASE_URL);
      const req = httpRequest({ host: url.hostname, port: url.port, path: url.pathname, method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded', 'content-length': String(64 * 1024 * 1024), origin: ORIGIN } }, (res) => {
        res.resume();
        resolve(res.statusCode ?? 0);
        req.destroy();
      });
      req.on('error', (e) => ((e as NodeJS.ErrnoException).code === 'ECONNRESET' ? undefined : reject(e)));
      req.write('email=a');
      setTimeout(() => reject(new Error('no answer while the body was still owed')), 5000);
    });
    expect(status).toBe(413);
  });

  it('answer a cross-site text/plain post with the JSON error shape', async () => {
    for (const path of ['/api/plans', '/login', '/plans/new']) {
      const r = await clients.lead.request('POST', path, { body: '{"title":"x"}', headers: { 'content-type': 'text/plain', origin: 'http://elsewhere.example.test' } });
      expect(r.status, path).toBe(403);
      expect(r.headers.get('content-type')).toMatch(/application\/json/);
      expect(r.body.error.code, path).toBe('ORIGIN_REJECTED');
    }
    const noOrigin = await clients.lead.request('POST', '/api/plans', { body: '{}', headers: { 'content-type': 'text/plain' } });
    expect(noOrigin.status).toBe(403);
    expect(noOrigin.body.error.code).toBe('ORIGIN_REJECTED');
  });
});

describe('the redirect after sign-in', () => {
  const hostile = ['/%5Cevil.test/phish', '/%09/evil.test/phish', '%09//evil.test', '//evil.test', '/%0A/evil.test', 'https://evil.test/', '/.//evil.test', '%5C%5Cevil.test'];

  it('never leaves the site after signing in', async () => {
    for (const next of hostile) {
      const r = await new Client().request('POST', `/login?next=${next}`, {
        body: new URLSearchParams({ email: team.apprentice.email, password: PASSWORD }).toString(),
        headers: { 'content-type': 'application/x-www-form-urlencoded', origin: ORIGIN },
      });
      expect(r.status, next).toBe(303);
      const location = r.headers.get('location')!;
      expect(new URL(location, BASE_URL).origin, `${next} → ${location}`).toBe(ORIGIN);
    }
  });

  it('never leaves the site on a plain GET when signed in, and keeps a same-site path', async () => {
    for (const next of hostile) {
      const r = await clients.lead.get(`/login?next=${next}`);
      expect(r.status, next).toBe(303);
      expect(new URL(r.headers.get('location')!, BASE_URL).origin, next).toBe(ORIGIN);
    }
    const ok = await clients.lead.get(`/login?next=${encodeURIComponent(`/plans/${planId}?tab=history`)}`);
    expect(ok.headers.get('location')).toBe(`/plans/${planId}?tab=history`);
  });
});

/** Streams up to `total` bytes (chunked, no Content-Length) until the server answers or closes; how much went out. */
function streamUntilAnswered(path: string, type: string, total: number): Promise<{ status: number; sent: number }> {
  return new Promise((resolve, reject) => {
    const url = new URL(path, BASE_URL);
    let sent = 0;
    let answered = false;
    const req = httpRequest({ host: url.hostname, port: url.port, path: url.pathname, method: 'POST', headers: { 'content-type': type, 'transfer-encoding': 'chunked', origin: ORIGIN } }, (res) => {
      answered = true;
      res.resume();
      resolve({ status: res.statusCode ?? 0, sent });
      req.destroy();
    });
    req.on('error', (e) => {
      if (answered) return;
      answered = true;
      if (['EPIPE', 'ECONNRESET'].includes((e as NodeJS.ErrnoException).code ?? '')) resolve({ status: 0, sent });
      else reject(e);
    });
    const chunk = Buffer.alloc(256 * 1024, 0x61);
    const pump = () => {
      while (!answered && sent < total) {
        sent += chunk.length;
        if (!req.write(chunk)) return void req.once('drain', pump);
      }
      if (!answered) req.end();
    };
    pump();
    setTimeout(() => (answered ? undefined : reject(new Error(`no answer after ${sent} bytes`))), 20_000);
  });
}
