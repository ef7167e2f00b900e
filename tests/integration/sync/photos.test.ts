// Photo bytes: PUT /api/photos/{sha256}, GET it and its thumbnail, and the photo.add that names it.
import { createHash, randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testPool } from '../../support/database';
import { createOrganisation, FIXTURE_PASSWORD, type OrganisationFixture } from '../../support/fixtures';
import { call, signIn, type Session } from '../../support/http';
import { pull, pullAll, pushOk } from '../../support/sync-client';
import { TestDevice } from '../../support/sync-ops';
import { createVisit, createVisitSetup, type VisitSetup } from '../../support/visit-fixtures';

let org: OrganisationFixture;
let setup: VisitSetup;
let tech: Session;
let otherTech: Session;
let office: Session;
let outsider: Session;

const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

async function picture(seed: number, width = 1200, height = 800) {
  return new Uint8Array(
    await sharp({ create: { width, height, channels: 3, background: { r: seed % 255, g: 90, b: 120 } } })
      .png()
      .toBuffer(),
  );
}

function upload(session: Session, bytes: Uint8Array, options: { hash?: string; type?: string } = {}) {
  return call(session, `/api/photos/${options.hash ?? sha(bytes)}`, {
    method: 'PUT',
    body: bytes,
    headers: { 'content-type': options.type ?? 'image/png' },
  });
}

beforeAll(async () => {
  org = await createOrganisation('Photos');
  const elsewhere = await createOrganisation('Elsewhere');
  setup = await createVisitSetup(org);
  [tech, otherTech, office, outsider] = await Promise.all([
    signIn(org.technician.email, FIXTURE_PASSWORD),
    signIn(org.otherTechnician.email, FIXTURE_PASSWORD),
    signIn(org.office.email, FIXTURE_PASSWORD),
    signIn(elsewhere.office.email, FIXTURE_PASSWORD),
  ]);
});
afterAll(async () => {
  await testPool().end();
});

describe('photo upload', () => {
  it('stores the bytes once under their hash, makes a thumbnail, and serves both to allowed users', async () => {
    const bytes = await picture(1);
    const first = await upload(tech, bytes);
    expect(first.status).toBe(201);
    expect(await first.json()).toMatchObject({ sha256: sha(bytes), contentType: 'image/png', sizeBytes: bytes.byteLength, width: 1200, height: 800 });
    expect((await upload(tech, bytes)).status).toBe(200);

    const original = await call(tech, `/api/photos/${sha(bytes)}`);
    expect(original.status).toBe(200);
    expect(original.headers.get('content-type')).toBe('image/png');
    expect(sha(new Uint8Array(await original.arrayBuffer()))).toBe(sha(bytes));

    const thumbnail = await call(office, `/api/photos/${sha(bytes)}/thumbnail`);
    expect(thumbnail.headers.get('content-type')).toBe('image/webp');
    const meta = await sharp(Buffer.from(await thumbnail.arrayBuffer())).metadata();
    expect(Math.max(meta.width!, meta.height!)).toBe(320);

    // Another technician sees it only once it is on one of their visits; another business never.
    expect((await call(otherTech, `/api/photos/${sha(bytes)}`)).status).toBe(404);
    expect((await call(outsider, `/api/photos/${sha(bytes)}`)).status).toBe(404);
  });

  it('judges the type from the bytes and checks the hash and the size', async () => {
    const bytes = await picture(2);
    const text = new TextEncoder().encode('not a picture at all');
    expect((await upload(tech, text)).status).toBe(415);
    const jpegClaim = await upload(tech, bytes, { type: 'image/jpeg' });
    expect(jpegClaim.status).toBe(415);
    expect((await jpegClaim.json()).error).toMatch(/image\/png/);
    expect((await upload(tech, bytes, { type: 'application/octet-stream' })).status).toBe(415);
    const wrongHash = await upload(tech, bytes, { hash: sha(text) });
    expect(wrongHash.status).toBe(422);
    const truncated = bytes.slice(0, 200);
    expect((await upload(tech, truncated)).status).toBe(422);
    const huge = new Uint8Array(8 * 1024 * 1024 + 1);
    huge.set(bytes.slice(0, 16));
    expect((await upload(tech, huge)).status).toBe(413);
  });
});

describe('photo.add', () => {
  it('is refused until the bytes are uploaded, then applied and pulled with our URLs', async () => {
    const visitId = await createVisit(org, setup);
    const bytes = await picture(3, 640, 480);
    const phone = new TestDevice(`tara-${randomUUID().slice(0, 6)}`, Date.now() - 60_000);
    const photoId = randomUUID();
    const early = phone.photoAdd(visitId, photoId, sha(bytes), { sizeBytes: 1 });
    expect((await pushOk(tech, phone.deviceId, [early])).get(early.opId)).toMatchObject({ outcome: 'rejected', reason: expect.stringMatching(/upload/) });

    expect((await upload(tech, bytes)).status).toBe(201);
    const { cursor } = await pullAll(tech);
    expect((await pushOk(tech, phone.deviceId, [early])).get(early.opId)?.outcome).toBe('applied');
    const pulled = await pull(tech, cursor);
    const photo = pulled.json.photos.find((p) => p.id === photoId)!;
    expect(photo).toMatchObject({ sha256: sha(bytes), contentType: 'image/png', removed: false, url: `/api/photos/${sha(bytes)}` });
    expect((await call(tech, photo.thumbnailUrl!)).status).toBe(200);

    const remove = phone.photoRemove(visitId, photoId, early.stamp);
    await pushOk(tech, phone.deviceId, [remove]);
    const afterRemove = await pull(tech, pulled.json.cursor);
    expect(afterRemove.json.photos.find((p) => p.id === photoId)?.removed).toBe(true);
  });
});
