/**
 * Photos of a field record over HTTP against the local object store (s3rver): real images made
 * here with sharp, the type judged by content, the size limit enforced before anything is stored,
 * nothing left behind when an upload fails halfway, location kept only where the organisation allows.
 */
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, Client, signedIn } from '../helpers/api';
import { jpegWithLocation, storedKeys, upload } from '../helpers/photos';
import { closeTestDb, makeOrganization, makePerson, makeTeam, PASSWORD, testDb } from '../helpers/factories';
import { approvedPlan } from '../helpers/records';

let team: Awaited<ReturnType<typeof makeTeam>>;
let lead: Client;
let recordId: number;

async function download(client: Client, path: string): Promise<{ status: number; type: string | null; bytes: Buffer }> {
  const response = await client.getRaw(path);
  return { status: response.status, type: response.headers.get('content-type'), bytes: Buffer.from(await response.arrayBuffer()) };
}

beforeAll(async () => {
  team = await makeTeam();
  lead = await signedIn(team.lead.email, PASSWORD);
  const reviewer = await signedIn(team.reviewer.email, PASSWORD);
  const planId = await approvedPlan(lead, reviewer);
  recordId = (await lead.post(`/api/plans/${planId}/records`)).body.id;
});
afterAll(closeTestDb);

describe('uploading photos', () => {
  it('stores a real JPEG as three objects under a random key, with no location in what is shown', async () => {
    const response = await upload(lead, recordId, await jpegWithLocation(), 'IMG_0001.jpg', 'image/jpeg', 'All three phases on the cluster bar');
    expect(response.status, response.text).toBe(201);
    expect(response.body).toMatchObject({ mime: 'image/jpeg', width: 1200, height: 900, caption: 'All three phases on the cluster bar' });
    const keys = await storedKeys(recordId);
    expect(keys).toHaveLength(3);
    expect(keys.join(' ')).not.toContain('IMG_0001');
    expect(keys.map((k) => k.split('/').pop())).toEqual(['display', 'original', 'thumb']);
    const thumb = await download(lead, `${response.body.url}?size=thumb`);
    expect(thumb.type).toBe('image/jpeg');
    const thumbMeta = await sharp(thumb.bytes).metadata();
    expect(Math.max(thumbMeta.width!, thumbMeta.height!)).toBe(320);
    expect(thumbMeta.exif).toBeUndefined();
    const display = await sharp((await download(lead, response.body.url)).bytes).metadata();
    expect([display.width, display.exif]).toEqual([1200, undefined]);
    // The organisation has not allowed location, so the original is stored without metadata too.
    expect((await sharp((await download(lead, `${response.body.url}?size=original`)).bytes).metadata()).exif).toBeUndefined();
  });

  it('stores a real PNG', async () => {
    const png = await sharp({ create: { width: 640, height: 480, channels: 4, background: '#d9e3f0' } }).png().toBuffer();
    const response = await upload(lead, recordId, png, 'bar.png', 'image/png');
    expect(response.status, response.text).toBe(201);
    expect(response.body).toMatchObject({ mime: 'image/png', width: 640, height: 480 });
    const original = await download(lead, `${response.body.url}?size=original`);
    expect(original.type).toBe('image/png');
  });

  it('refuses a text file renamed .jpg, judging by content, and stores nothing', async () => {
    const before = await storedKeys(recordId);
    const response = await upload(lead, recordId, Buffer.from('not a photo at all, just words\n'.repeat(40)), 'photo.jpg', 'image/jpeg');
    expect(response.status).toBe(415);
    expect(response.body.error.code).toBe('PHOTO_TYPE');
    expect(await storedKeys(recordId)).toEqual(before);
  });

  it('refuses a 16 MB file with 413 before anything is stored', async () => {
    const before = await storedKeys(recordId);
    const big = Buffer.concat([await jpegWithLocation(64, 64), Buffer.alloc(16 * 1024 * 1024)]);
    const response = await upload(lead, recordId, big, 'huge.jpg', 'image/jpeg');
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('PHOTO_TOO_LARGE');
    expect(await storedKeys(recordId)).toEqual(before);
  });

  it('removes the stored original when the upload fails halfway (a truncated JPEG)', async () => {
    // Location allowed: the original is stored as sent, before the sizes are made from it.
    const org = await makeOrganization('Location Keeping Invented Co-operative');
    await testDb().sequelize.query('UPDATE organizations SET keep_photo_location = 1 WHERE id = ?', { replacements: [org] });
    const keeperLead = await makePerson(org, 'crew_lead');
    const keeperReviewer = await makePerson(org, 'reviewer');
    const client = await signedIn(keeperLead.email, PASSWORD);
    const planId = await approvedPlan(client, await signedIn(keeperReviewer.email, PASSWORD));
    const id = (await client.post(`/api/plans/${planId}/records`)).body.id;
    const whole = await jpegWithLocation();
    const broken = await upload(client, id, whole.subarray(0, Math.floor(whole.length / 2)), 'cut.jpg', 'image/jpeg');
    expect(broken.status).toBe(400);
    expect(broken.body.error.code).toBe('PHOTO_UNREADABLE');
    expect(await storedKeys(id)).toEqual([]);
    // The same organisation's whole photo keeps its location in the original only.
    const ok = await upload(client, id, whole, 'whole.jpg', 'image/jpeg');
    expect(ok.status).toBe(201);
    expect((await sharp((await download(client, `${ok.body.url}?size=original`)).bytes).metadata()).exif).toBeDefined();
    expect((await sharp((await download(client, ok.body.url)).bytes).metadata()).exif).toBeUndefined();
  });

  it('without a file field is 400 naming photo', async () => {
    const form = new FormData();
    form.set('caption', 'no file');
    const request = new Request(`${BASE_URL}/x`, { method: 'POST', body: form });
    const response = await lead.request('POST', `/api/records/${recordId}/photos`, { body: new Uint8Array(await request.arrayBuffer()), headers: { ...Object.fromEntries(request.headers.entries()), origin: lead.baseUrl } });
    expect(response.status).toBe(400);
    expect(response.body.error.issues[0].path).toBe('photo');
  });
});

describe('who sees photos', () => {
  it('another organisation gets 404; apprentices only once the record is closed', async () => {
    const listed = (await lead.get(`/api/records/${recordId}`)).body.record.photos;
    expect(listed.length).toBeGreaterThan(0);
    const other = await signedIn((await makePerson(await makeOrganization('Stranger Invented Co-operative'), 'admin')).email, PASSWORD);
    expect((await download(other, listed[0].url)).status).toBe(404);
    const apprentice = await signedIn(team.apprentice.email, PASSWORD);
    expect((await download(apprentice, listed[0].url)).status).toBe(403);
    expect((await lead.post(`/api/records/${recordId}/close`)).status).toBe(200);
    expect((await download(apprentice, `${listed[0].url}?size=thumb`)).status).toBe(200);
  });
});
