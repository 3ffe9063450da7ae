/**
 * The local object store that npm start and npm test run: reused when it answers our handshake,
 * refused when a stranger holds the port.
 */
import { randomBytes } from 'node:crypto';
import { readFileSync, rmSync } from 'node:fs';
import { createServer, type AddressInfo, type Server } from 'node:net';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ROOT, startObjectStore, stopObjectStore } from '../../scripts/lib.mjs';

const profile = `unit-${randomBytes(4).toString('hex')}`;
afterAll(async () => {
  await stopObjectStore(profile);
  rmSync(join(ROOT, '.data', profile), { recursive: true, force: true });
});

function listen(server: Server): Promise<number> {
  return new Promise((done) => server.listen(0, '127.0.0.1', () => done((server.address() as AddressInfo).port)));
}

describe('the local object store', () => {
  it('refuses to treat a stranger on the port as its store', async () => {
    const stranger = createServer((socket) => {
      socket.on('error', () => undefined); // the port probe hangs up at once
      socket.end('HTTP/1.1 200 OK\r\ncontent-length: 2\r\n\r\nhi');
    });
    const port = await listen(stranger);
    try {
      await expect(startObjectStore({ profile, port })).rejects.toThrow(/not this project's object store/);
    } finally {
      stranger.close();
    }
  });

  it('starts once, then reuses the same process while it answers the handshake', async () => {
    const probe = createServer();
    const port = await listen(probe);
    await new Promise((done) => probe.close(done));
    const env = await startObjectStore({ profile, port });
    expect(env).toMatchObject({ BONDMAP_S3_ENDPOINT: `http://127.0.0.1:${port}`, BONDMAP_S3_BUCKET: 'bondmap-photos' });
    const pid = readFileSync(join(ROOT, '.data', profile, 'object-store.pid'), 'utf8');
    await startObjectStore({ profile, port });
    expect(readFileSync(join(ROOT, '.data', profile, 'object-store.pid'), 'utf8')).toBe(pid);
    expect(await stopObjectStore(profile)).toBe(true);
  }, 40_000);
});
