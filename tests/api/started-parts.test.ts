/**
 * `npm start` and `npm test` reuse a started part only when it proves to be theirs: the mail
 * catcher by its pid file AND the per-start token in its SMTP greeting, the app server by the
 * token in its health answer. Another program on the port is refused, saying so.
 */
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, type AddressInfo, type Server } from 'node:net';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { ROOT, startMailCatcher, startServer } from '../../scripts/lib.mjs';

const PROFILE = 'handshake-test';
const dir = join(ROOT, '.data', PROFILE);
const servers: Server[] = [];

afterAll(() => {
  for (const s of servers) s.close();
  rmSync(dir, { recursive: true, force: true });
});

/** A stranger on a free port that greets like an SMTP server (another checkout's catcher). */
async function strangerSmtp(): Promise<number> {
  const server = createServer((socket) => socket.end("220 Bondmap local mail catcher 0123456789abcdef01234567\r\n"));
  servers.push(server);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  return (server.address() as AddressInfo).port;
}

it('refuses to take another mail catcher for its own, even when its pid file names a live process', async () => {
  const port = await strangerSmtp();
  mkdirSync(dir, { recursive: true });
  writeFileSync(join(dir, 'mail-catcher.pid'), String(process.pid)); // alive, but not the catcher
  writeFileSync(join(dir, 'mail-catcher.token'), 'a-token-of-our-own-start');
  await expect(startMailCatcher({ profile: PROFILE, port, env: {} })).rejects.toThrow(/answers .*but not as this checkout's mail catcher/);
});

it('refuses a port where an app server of someone else answers', async () => {
  const http = await import('node:http');
  const impostor = http.createServer((_req, res) => res.writeHead(200, { 'content-type': 'application/json' }).end('{"ok":true}'));
  await new Promise<void>((r) => impostor.listen(0, '127.0.0.1', r));
  const port = (impostor.address() as AddressInfo).port;
  try {
    await expect(startServer({ port, env: {}, stdio: 'ignore' })).rejects.toThrow(/in use|not as the server just started/);
  } finally {
    impostor.close();
  }
});
