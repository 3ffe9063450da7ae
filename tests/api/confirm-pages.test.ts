/** Disable (admin people) and Return (review) ask first: the pages mark them and load the bundled script. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, PASSWORD } from '../helpers/factories';

let team: Awaited<ReturnType<typeof makeTeam>>;
let admin: Client;
beforeAll(async () => {
  team = await makeTeam();
  admin = await signedIn(team.admin.email, PASSWORD);
});
afterAll(closeTestDb);

describe('confirmations', () => {
  it('the people page asks before Disable, from a bundled script the CSP allows', async () => {
    const page = await admin.get('/admin/users');
    expect(page.status).toBe(200);
    expect(page.text).toMatch(/value="disable" data-confirm="Disable [^"]+\? They are signed out everywhere/);
    // Astro bundles the script; when it inlines it, the policy carries the script's hash.
    expect(page.text).toMatch(/<script[^>]*type="module"/);
    expect(page.headers.get('content-security-policy') ?? '').toMatch(/script-src 'self' 'sha256-/);
  });
});
