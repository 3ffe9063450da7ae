/**
 * The test run's ports: the ones given in the environment win (parallel runs rely on them), the
 * others are drawn free, never twice and never onto a given one.
 */
import { createServer, type AddressInfo } from 'node:net';
import { describe, expect, it, vi } from 'vitest';
import { freePort, testPorts } from '../../scripts/lib.mjs';
import { waitForSteady } from '../helpers/wait';

describe('testPorts', () => {
  it('keeps every port given in the environment and draws none', async () => {
    const env = { BONDMAP_TEST_PORT: '4416', BONDMAP_TEST_SMTP_PORT: '2616', BONDMAP_TEST_S3_PORT: '4616', BONDMAP_TEST_DB_PORT: '3416' };
    const ports = await testPorts(env, () => Promise.reject(new Error('drew a port although all were given')));
    expect(ports).toMatchObject({ port: 4416, smtpPort: 2616, s3Port: 4616, dbPort: 3416, picked: [] });
  });

  it('draws the missing ones, each once, past the given ones', async () => {
    const seen: Set<number>[] = [];
    // A drawer that offers the given port first: testPorts must have named it taken already.
    const pick = async (taken: Set<number>) => {
      seen.push(new Set(taken));
      for (const candidate of [4416, 20001, 20002, 20003, 20004]) if (!taken.has(candidate)) return taken.add(candidate), candidate;
      throw new Error('out of candidates');
    };
    const ports = await testPorts({ BONDMAP_TEST_PORT: '4416', BONDMAP_TEST_DB_PORT: '3416' }, pick);
    expect(ports.port).toBe(4416);
    expect(ports.dbPort).toBe(3416);
    expect(ports.picked).toEqual([ports.smtpPort, ports.s3Port]);
    expect(new Set([ports.port, ports.smtpPort, ports.s3Port, ports.dbPort]).size).toBe(4);
    expect(seen[0].has(4416) && seen[0].has(3416)).toBe(true);
  });
});

describe('freePort', () => {
  it('gives a port below the outgoing-connection range that nothing holds, and never one twice', async () => {
    const taken = new Set<number>();
    const a = await freePort(taken);
    const b = await freePort(taken);
    expect(a).not.toBe(b);
    for (const p of [a, b]) {
      expect(p).toBeGreaterThanOrEqual(20000);
      expect(p).toBeLessThan(32000);
    }
    // It really is free: we can listen on it.
    const server = createServer();
    await new Promise<void>((r) => server.listen(a, '127.0.0.1', r));
    expect((server.address() as AddressInfo).port).toBe(a);
    server.close();
  });

  it('skips a port something listens on', async () => {
    const held = await freePort();
    const busy = createServer();
    await new Promise<void>((r) => busy.listen(held, '127.0.0.1', r));
    const other = await freePort(new Set([held]));
    // The draw lands on the held port first, then on another one.
    const at = (port: number) => (port - 20000 + 0.5) / 12000;
    const draws = vi.spyOn(Math, 'random').mockReturnValueOnce(at(held)).mockReturnValueOnce(at(other));
    try {
      expect(await freePort()).toBe(other);
      expect(draws).toHaveBeenCalledTimes(2);
    } finally {
      draws.mockRestore();
      busy.close();
    }
  });
});

describe('waitForSteady', () => {
  it('returns once the value stops changing, and throws while it keeps changing', async () => {
    let n = 0;
    expect(await waitForSteady(() => Math.min((n += 1), 5), { quiet: 100, every: 10 })).toBe(5);
    await expect(waitForSteady(() => (n += 1), { quiet: 100, every: 10, deadline: 300 })).rejects.toThrow(/kept changing/);
  });
});
