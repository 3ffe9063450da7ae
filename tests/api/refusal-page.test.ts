/** A page refused for the role answers 403 inside the app's shell (navigation, caution), naming the roles. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, PASSWORD } from '../helpers/factories';

let apprentice: Client;
beforeAll(async () => {
  const team = await makeTeam();
  apprentice = await signedIn(team.apprentice.email, PASSWORD);
});
afterAll(closeTestDb);

describe('the 403 page', () => {
  it('has the app shell, the roles needed, and its script hashes in the policy', async () => {
    const page = await apprentice.get('/plans/new');
    expect(page.status).toBe(403);
    expect(page.text).toContain('data-testid="refused"');
    expect(page.text).toContain('Not for your role');
    expect(page.text).toMatch(/crew lead/i);
    // The shell: the navigation the apprentice may use.
    expect(page.text).toContain('href="/library"');
    expect(page.text).not.toContain('href="/plans/new"');
    const admin = await apprentice.get('/admin/users');
    expect(admin.status).toBe(403);
    expect(admin.text).toContain('data-testid="refused"');
  });
});
