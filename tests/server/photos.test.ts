import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PhotoSchema } from '../../server/src/modules/photos/photo.entity';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { del, expectProblem, newJob, newRoom, patch, post, type JobRef } from './jobs-helpers';

let t: TestApp;
let a: TestCompany;
let b: TestCompany;
let sales: Session;
let job: JobRef;
let room: JobRef;
const MAX = 64 * 1024;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

beforeAll(async () => {
  t = await buildTestApp({ UPLOAD_MAX_BYTES: MAX });
  a = await makeCompany(t.orm.em.fork(), 'PhotosA');
  b = await makeCompany(t.orm.em.fork(), 'PhotosB');
  sales = await login(t.app, a.users.salesperson.email);
  job = await newJob(sales);
  room = await newRoom(sales, job.id);
});
afterAll(async () => t.close());

const url = () => `/api/jobs/${job.id}/rooms/${room.id}/photos`;
const image = (width = 64, height = 48) => sharp({ create: { width, height, channels: 3, background: '#3a7ca5' } });
/** A JPEG carrying camera EXIF with a GPS position, as a phone writes it. */
const withGps = () =>
  image()
    .withExif({
      IFD0: { Make: 'Testcam', Orientation: '1' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' },
    })
    .jpeg()
    .toBuffer();
const upload = (s: Session, bytes: Buffer, filename = 'kitchen.jpg', contentType = 'image/jpeg') =>
  post(s, url()).attach('file', bytes, { filename, contentType });

describe('photos: access', () => {
  it('401 signed out, 403 for an installer, 404 for another company', async () => {
    const jpg = await image().jpeg().toBuffer();
    expectProblem(await browserAgent(t.app).get(`${url()}/00000000-0000-4000-8000-000000000000`).set(HTTPS), 401);
    expectProblem(await upload(await login(t.app, a.users.installer.email), jpg), 403);
    const other = await login(t.app, b.users.salesperson.email);
    expectProblem(await upload(other, jpg), 404);
    const ok = await upload(sales, jpg);
    expect(ok.status).toBe(201);
    expectProblem(await other.agent.get(`${url()}/${ok.body.photo.id}`), 404);
    expectProblem(await del(other, `${url()}/${ok.body.photo.id}`), 404);
    expectProblem(await (await login(t.app, a.users.installer.email)).agent.get(`${url()}/${ok.body.photo.id}`), 404);
  });
});

describe('photos: bad uploads', () => {
  it('a renamed non-image is refused by content (415), whatever its name and declared type', async () => {
    const r = await upload(sales, Buffer.from('#!/bin/sh\necho not a photo\n'.repeat(20)), 'photo.jpg', 'image/jpeg');
    expectProblem(r, 415);
    expect(r.body.detail).toBe(
      'This file is not a JPEG, PNG or WebP photo (its content was checked, not its name). Upload a photo in one of those formats.',
    );
    const pdf = await upload(sales, Buffer.from('%PDF-1.7\n%âãÏÓ\n1 0 obj\n<<>>\nendobj\n'), 'room.png', 'image/png');
    expectProblem(pdf, 415);
  });

  it('HEIC is refused with a clear message (this sharp build cannot decode it)', async () => {
    const heic = Buffer.concat([
      Buffer.from([0, 0, 0, 0x18]),
      Buffer.from('ftypheic'),
      Buffer.from([0, 0, 0, 0]),
      Buffer.from('mif1heic'),
      Buffer.alloc(64),
    ]);
    const r = await upload(sales, heic, 'IMG_0001.HEIC', 'image/heic');
    expectProblem(r, 415);
    expect(r.body.detail).toMatch(/HEIC photos are not accepted yet/);
  });

  it('an oversize file gets 413 problem+json; nothing is stored', async () => {
    const before = await t.orm.em.fork().count(PhotoSchema, {});
    const big = await image(1200, 1200).png({ compressionLevel: 0 }).toBuffer();
    expect(big.length).toBeGreaterThan(MAX);
    const r = await upload(sales, big, 'big.png', 'image/png');
    expectProblem(r, 413);
    expect(r.body.detail).toBe('The photo is larger than 0.1 MB.');
    expect(await t.orm.em.fork().count(PhotoSchema, {})).toBe(before);
  });

  it('no file, a wrong field, two files or a JSON body → 4xx problem+json', async () => {
    expectProblem(await post(sales, url()).field('note', 'x'), 400);
    const jpg = await image().jpeg().toBuffer();
    expectProblem(await post(sales, url()).attach('photo', jpg, 'a.jpg'), 400);
    expectProblem(await post(sales, url()).attach('file', jpg, 'a.jpg').attach('file', jpg, 'b.jpg'), 400);
    expectProblem(await post(sales, url()).send({ file: 'x' }), 400);
    expectProblem(
      await post(sales, url()).set('Content-Type', 'multipart/form-data; boundary=zz').send('--zz\r\nbroken'),
      400,
    );
  });

  it('a path-traversal file name is harmless: the key is a uuid, the name is only shown, sanitised', async () => {
    const r = await upload(sales, await image().jpeg().toBuffer(), '../../etc/passwd');
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    expect(r.body.photo.originalName).toBe('passwd');
    const row = await t.orm.em.fork().findOneOrFail(PhotoSchema, { id: r.body.photo.id });
    expect(row.storageKey).toMatch(UUID);
    expect(row.storageKey).not.toBe(row.id);
    expect(await t.services.storage.get(row.storageKey)).not.toBeNull();
    const win = await upload(sales, await image().jpeg().toBuffer(), '..\\..\\windows\\system.ini\u202egpj.exe');
    expect(win.body.photo.originalName).toBe('system.inigpj.exe');
  });
});

describe('photos: happy path', () => {
  it('re-encodes as JPEG without EXIF or GPS, serves the bytes only through the route, deletes', async () => {
    const src = await withGps();
    expect((await sharp(src).metadata()).exif).toBeDefined();
    const r = await upload(sales, src, 'living room.jpg');
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const id = String(r.body.photo.id);
    expect(r.body.photo).toMatchObject({
      contentType: 'image/jpeg',
      width: 64,
      height: 48,
      originalName: 'living room.jpg',
      url: `${url()}/${id}`,
    });

    const got = await sales.agent
      .get(`${url()}/${id}`)
      .buffer(true)
      .parse((res, cb) => {
        const parts: Buffer[] = [];
        res.on('data', (c: Buffer) => parts.push(c));
        res.on('end', () => cb(null, Buffer.concat(parts)));
      });
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/jpeg');
    expect(got.headers['x-content-type-options']).toBe('nosniff');
    expect(got.headers['content-disposition']).toBe(`inline; filename="room-photo-${id}.jpg"`);
    expect(got.headers['cache-control']).toMatch(/^private/);
    const meta = await sharp(got.body).metadata();
    expect(meta.format).toBe('jpeg');
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();

    const list = await sales.agent.get(`/api/jobs/${job.id}/rooms/${room.id}`);
    expect(list.body.room.photos.map((p: { id: string }) => p.id)).toContain(id);

    const row = await t.orm.em.fork().findOneOrFail(PhotoSchema, { id });
    expect((await del(sales, `${url()}/${id}`)).status).toBe(204);
    expectProblem(await sales.agent.get(`${url()}/${id}`), 404);
    expect(await t.services.storage.get(row.storageKey)).toBeNull();
  });

  it('turns a photo upright by its EXIF orientation and accepts PNG and WebP', async () => {
    const sideways = await image(40, 20).jpeg().withMetadata({ orientation: 6 }).toBuffer();
    const r = await upload(sales, sideways, 'side.jpg');
    expect([r.body.photo.width, r.body.photo.height]).toEqual([20, 40]);
    expect((await upload(sales, await image().png().toBuffer(), 'a.png', 'image/png')).body.photo.contentType).toBe(
      'image/jpeg',
    );
    expect((await upload(sales, await image().webp().toBuffer(), 'a.webp', 'image/webp')).status).toBe(201);
  });

  it('deleting the room removes its photos and their files', async () => {
    const r2 = await newRoom(sales, job.id);
    const up = await post(sales, `/api/jobs/${job.id}/rooms/${r2.id}/photos`).attach(
      'file',
      await image().jpeg().toBuffer(),
      'x.jpg',
    );
    const row = await t.orm.em.fork().findOneOrFail(PhotoSchema, { id: up.body.photo.id });
    await patch(sales, `/api/jobs/${job.id}/rooms/${r2.id}`, r2.version).send({ position: 9 });
    expect((await del(sales, `/api/jobs/${job.id}/rooms/${r2.id}`, r2.version + 1)).status).toBe(204);
    expect(await t.orm.em.fork().count(PhotoSchema, { id: row.id })).toBe(0);
    expect(await t.services.storage.get(row.storageKey)).toBeNull();
  });
});
