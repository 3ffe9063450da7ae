/**
 * A photo sent again with its clientId (the device lost the answer) is stored once: one row and one
 * set of objects in the store, also when the repeats race; a new clientId is a new photo.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from '../helpers/api';
import { closeTestDb, makeTeam, PASSWORD } from '../helpers/factories';
import { jpegWithLocation, storedKeys, upload } from '../helpers/photos';
import { approvedPlan } from '../helpers/records';

let lead: Client;
let planId: number;
let photo: Buffer;

const newRecord = async (): Promise<number> => (await lead.post(`/api/plans/${planId}/records`)).body.id;
const photoRows = async (recordId: number) => (await lead.get(`/api/records/${recordId}`)).body.record.photos as { id: number }[];

beforeAll(async () => {
  const team = await makeTeam();
  lead = await signedIn(team.lead.email, PASSWORD);
  planId = await approvedPlan(lead, await signedIn(team.reviewer.email, PASSWORD));
  photo = await jpegWithLocation(400, 300);
});
afterAll(closeTestDb);

describe('a photo sent again with the same clientId', () => {
  it('answers 200 with the stored photo and stores no second row or objects', async () => {
    const recordId = await newRecord();
    const clientId = randomUUID();
    const first = await upload(lead, recordId, photo, 'a.jpg', 'image/jpeg', 'Cluster bar', clientId);
    expect(first.status, first.text).toBe(201);
    expect(first.body.clientId).toBe(clientId);
    const keys = await storedKeys(recordId);
    expect(keys).toHaveLength(3);
    const again = await upload(lead, recordId, photo, 'a.jpg', 'image/jpeg', 'Cluster bar', clientId);
    expect(again.status, again.text).toBe(200);
    expect(again.body).toMatchObject({ id: first.body.id, url: first.body.url, caption: 'Cluster bar' });
    expect(await photoRows(recordId)).toHaveLength(1);
    expect(await storedKeys(recordId)).toEqual(keys);
  });

  it('five repeats sent at once store one photo and one set of objects', async () => {
    const recordId = await newRecord();
    const clientId = randomUUID();
    const answers = await Promise.all(Array.from({ length: 5 }, () => upload(lead, recordId, photo, 'b.jpg', 'image/jpeg', 'Tower leg', clientId)));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 200, 200, 201]);
    expect(new Set(answers.map((a) => a.body.id)).size).toBe(1);
    expect(await photoRows(recordId)).toHaveLength(1);
    expect(await storedKeys(recordId)).toHaveLength(3);
  });

  it('a different clientId is a second photo; no clientId at all still stores each upload', async () => {
    const recordId = await newRecord();
    expect((await upload(lead, recordId, photo, 'c.jpg', 'image/jpeg', '', randomUUID())).status).toBe(201);
    expect((await upload(lead, recordId, photo, 'c.jpg', 'image/jpeg', '', randomUUID())).status).toBe(201);
    expect((await upload(lead, recordId, photo, 'c.jpg', 'image/jpeg')).status).toBe(201);
    expect(await photoRows(recordId)).toHaveLength(3);
    expect(await storedKeys(recordId)).toHaveLength(9);
  });

  it('refuses a clientId that is not a UUID with 400 naming clientId, and stores nothing', async () => {
    const recordId = await newRecord();
    const response = await upload(lead, recordId, photo, 'd.jpg', 'image/jpeg', '', 'photo-1');
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('VALIDATION');
    expect(response.body.error.issues).toEqual([expect.objectContaining({ path: 'clientId' })]);
    expect(await storedKeys(recordId)).toEqual([]);
  });

  it('a closed record still answers a repeat of a photo it holds, but takes no new one', async () => {
    const recordId = await newRecord();
    const clientId = randomUUID();
    const first = await upload(lead, recordId, photo, 'e.jpg', 'image/jpeg', '', clientId);
    expect((await lead.post(`/api/records/${recordId}/close`)).status).toBe(200);
    const again = await upload(lead, recordId, photo, 'e.jpg', 'image/jpeg', '', clientId);
    expect([again.status, again.body.id]).toEqual([200, first.body.id]);
    const fresh = await upload(lead, recordId, photo, 'f.jpg', 'image/jpeg', '', randomUUID());
    expect([fresh.status, fresh.body.error.code]).toEqual([409, 'RECORD_CLOSED']);
    expect(await storedKeys(recordId)).toHaveLength(3);
  });
});
