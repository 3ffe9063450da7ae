import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { requestListener } from '@/lib/server/request-listener';

// A client directory with a file at every path the listener must not look up, and a stand-in for
// Astro that says which paths reached it.
let root: string;
let server: Server;
let base: string;
const reachedAstro: string[] = [];

beforeAll(async () => {
  root = mkdtempSync(join(tmpdir(), 'bondmap-client-'));
  for (const dir of ['_astro', 'api/plans', 'icons', '.well-known']) mkdirSync(join(root, dir), { recursive: true });
  writeFileSync(join(root, '_astro', 'app.abc123.js'), 'console.log(1)');
  writeFileSync(join(root, 'favicon.svg'), '<svg/>');
  writeFileSync(join(root, 'api', 'health'), 'a file that must never answer /api/health');
  writeFileSync(join(root, 'api', 'plans', 'index.html'), 'nor /api/plans/');
  writeFileSync(join(root, '.secret'), 'a dotfile');
  writeFileSync(join(root, '.well-known', 'security.txt'), 'Contact: mailto:security@example.test');
  const astro = async (req: IncomingMessage, res: ServerResponse) => {
    reachedAstro.push(req.url ?? '');
    res.writeHead(200, { 'content-type': 'text/plain', 'x-from': 'astro' });
    res.end('astro');
  };
  server = createServer(requestListener(astro, root));
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(() => {
  server.close();
  rmSync(root, { recursive: true, force: true });
});

async function get(path: string) {
  reachedAstro.length = 0;
  const r = await fetch(base + path);
  return { status: r.status, from: r.headers.get('x-from'), cache: r.headers.get('cache-control'), body: await r.text(), astro: [...reachedAstro] };
}

describe('the request listener in front of Astro', () => {
  it('sends /api/… to Astro without looking for a file, even where one exists', async () => {
    expect(await get('/api/health')).toMatchObject({ status: 200, from: 'astro', astro: ['/api/health'] });
    expect(await get('/api/plans/?page=2')).toMatchObject({ from: 'astro', astro: ['/api/plans/?page=2'] });
  });

  it('serves files first, hashed assets cached for a year', async () => {
    const asset = await get('/_astro/app.abc123.js');
    expect(asset).toMatchObject({ status: 200, body: 'console.log(1)', astro: [] });
    expect(asset.cache).toBe('public, max-age=31536000, immutable');
    const icon = await get('/favicon.svg?v=2');
    expect(icon).toMatchObject({ status: 200, body: '<svg/>', astro: [] });
    expect(icon.cache).not.toContain('immutable');
  });

  it('hands pages, missing files, directories and dotfiles to Astro', async () => {
    for (const path of ['/plans', '/_astro/missing.js', '/icons', '/icons/', '/.secret']) {
      expect(await get(path)).toMatchObject({ from: 'astro', astro: [path] });
    }
    expect(await get('/.well-known/security.txt')).toMatchObject({ status: 200, astro: [] });
  });

  it('answers 400 to a URL that cannot be decoded, before Astro sees it', async () => {
    expect(await get('/plans/%E0%A4%A')).toMatchObject({ status: 400, astro: [] });
  });
});
