import fs from 'node:fs';
import path from 'node:path';
import { buffer } from 'node:stream/consumers';
import contentDisposition from 'content-disposition';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fileStoreOf } from './storage/file-store-of';
import { TINY_PNG, sampleDocument, sharedPattern, startTestServer, testDatabase, userClient, type Client, type TestServer } from './test/harness';

let t: TestServer;
let owner: Client;
let id: string;
beforeAll(async () => {
  t = await startTestServer();
  owner = await userClient(t.app, 'owner@uploads.test', 'designer');
  id = await sharedPattern(t, owner, [], 'Traced block');
});
afterAll(async () => {
  await t.close();
});

// Magic numbers: JPEG starts FF D8 FF (JFIF/ITU T.81); WebP is a RIFF container with "WEBP" at offset 8
// (Google's WebP container specification); GIF starts "GIF89a" (GIF 89a specification).
const JPEG = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]), Buffer.from('JFIF\0', 'latin1'), Buffer.alloc(64)]);
const WEBP = Buffer.concat([Buffer.from('RIFF', 'latin1'), Buffer.from([0x24, 0, 0, 0]), Buffer.from('WEBPVP8 ', 'latin1'), Buffer.alloc(40)]);
const GIF = Buffer.concat([Buffer.from('GIF89a', 'latin1'), Buffer.from([1, 0, 1, 0, 0x80, 0, 0]), Buffer.alloc(20)]);

/** The bytes stored under a key, from the server's file store (the data folder, or PostgreSQL), or undefined. */
const storedBytes = async (key: string) => {
  const stream = await fileStoreOf(t.ctx).openRead(key);
  return stream && (await buffer(stream));
};

/** The names of the files stored for a user's uploads. */
async function storedUploadNames(userId: string): Promise<string[]> {
  if (testDatabase === 'postgres') {
    const rows = await t.ctx.data.rows<{ key: string }>(sql`SELECT key FROM stored_files WHERE key LIKE ${`uploads/${userId}/%`}`);
    return rows.map((r) => r.key.slice(`uploads/${userId}/`.length));
  }
  const dir = path.join(t.dataDir, 'uploads', userId);
  return fs.existsSync(dir) ? fs.readdirSync(dir) : [];
}

const upload = (c: Client, data: Buffer, name: string, contentType?: string) =>
  c.req('post', `/api/patterns/${id}/uploads`).attach('file', data, contentType ? { filename: name, contentType } : name);

describe('reference image uploads', () => {
  it('accepts PNG, JPEG and WebP by their bytes and serves them back with their type', async () => {
    for (const [data, name, mime] of [
      [TINY_PNG, 'ref.png', 'image/png'],
      [JPEG, 'photo.jpeg', 'image/jpeg'],
      [WEBP, 'scan.webp', 'image/webp'],
    ] as const) {
      const res = await upload(owner, data, name).expect(201);
      expect(res.body.upload).toMatchObject({ mimeType: mime, bytes: data.length, fileName: name });
      const file = await owner.get(res.body.upload.url).buffer(true).expect(200);
      expect(file.headers['content-type']).toBe(mime);
      expect(file.headers['x-content-type-options']).toBe('nosniff');
      expect(Buffer.compare(Buffer.from(file.body), data)).toBe(0);
    }
  });

  it('answers 415 for a text file renamed .png, an SVG sent as image/png and a GIF', async () => {
    const text = await upload(owner, Buffer.from('just some text, honest\n'), 'notes.png', 'image/png');
    expect(text.status).toBe(415);
    expect(text.body.details.detected).toBe('unknown');
    const svg = await upload(owner, Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 'x.png', 'image/png');
    expect(svg.status).toBe(415);
    const gif = await upload(owner, GIF, 'anim.png', 'image/png');
    expect(gif.status).toBe(415);
    expect(gif.body.details.detected).toBe('image/gif');
    const stored = await storedUploadNames(owner.user!.id);
    expect(stored.length).toBeGreaterThan(0);
    expect(stored.every((f) => /^[A-Za-z0-9_-]{22}\.(png|jpg|webp)$/.test(f))).toBe(true);
  });

  it('answers 413 above 10 MB and 400 without a file', async () => {
    const big = Buffer.concat([TINY_PNG, Buffer.alloc(10 * 1024 * 1024)]);
    const res = await upload(owner, big, 'huge.png');
    expect(res.status).toBe(413);
    expect(res.body.error).toBe('The image is larger than 10 MB');
    const none = await owner.req('post', `/api/patterns/${id}/uploads`).field('other', 'x');
    expect(none.status).toBe(400);
    const json = await owner.post(`/api/patterns/${id}/uploads`, { file: 'iVBOR' });
    expect(json.status).toBe(415);
  });

  it('stores a hostile file name harmlessly under its own id, and downloads it', async () => {
    const res = await upload(owner, TINY_PNG, '../../../seamwright.db.png').expect(201);
    expect(res.body.upload.fileName).not.toContain('/');
    expect((await storedBytes(`uploads/${owner.user!.id}/${res.body.upload.id}.png`))?.equals(TINY_PNG)).toBe(true);
    const got = await owner.get(res.body.upload.url).buffer(true).expect(200);
    expect(Buffer.from(got.body).equals(TINY_PNG)).toBe(true);
    expect(contentDisposition.parse(got.headers['content-disposition']).parameters['filename']).toBe(res.body.upload.fileName);
  });

  /** A multipart body written by hand, so the part's Content-Disposition is exactly `disposition`. */
  const rawUpload = (disposition: Buffer | string) => {
    const boundary = 'sw-boundary-7d1a';
    const body = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; `),
      Buffer.from(disposition),
      Buffer.from('\r\nContent-Type: image/png\r\n\r\n'),
      TINY_PNG,
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    return owner.req('post', `/api/patterns/${id}/uploads`).set('Content-Type', `multipart/form-data; boundary=${boundary}`).send(body);
  };

  /** Downloads an upload and returns the file name its Content-Disposition gives (RFC 6266 parsing). */
  const downloadedName = async (url: string) => {
    const got = await owner.get(url).buffer(true);
    expect(got.status, JSON.stringify(got.body)).toBe(200);
    expect(Buffer.from(got.body).equals(TINY_PNG)).toBe(true);
    return contentDisposition.parse(got.headers['content-disposition']).parameters['filename'];
  };

  it('keeps a UTF-8 name sent as filename*=UTF-8\'\' (RFC 5987) and sends it back intact', async () => {
    const name = 'キルト 🧵 Ñandú.png';
    const res = await rawUpload(`filename*=UTF-8''${encodeURIComponent(name)}`).expect(201);
    expect(res.body.upload.fileName).toBe(name);
    expect(await downloadedName(res.body.upload.url)).toBe(name);
    const listed = await owner.get(`/api/patterns/${id}/uploads`).expect(200);
    expect(listed.body.items.find((u: { id: string }) => u.id === res.body.upload.id).fileName).toBe(name);
  });

  it('keeps a raw UTF-8 name (as browsers send it) instead of reading its bytes as Latin-1', async () => {
    const name = 'نقشه لحاف ☂.png';
    const res = await rawUpload(Buffer.concat([Buffer.from('filename="'), Buffer.from(name, 'utf8'), Buffer.from('"')])).expect(201);
    expect(res.body.upload.fileName).toBe(name);
    expect(await downloadedName(res.body.upload.url)).toBe(name);
  });

  it('drops control characters, quotes stay, and the download never fails on a name', async () => {
    const res = await rawUpload(`filename*=UTF-8''${encodeURIComponent('a\u001b[31mred\u0007 "quoted"\u0085\u202e.png')}`).expect(201);
    expect(res.body.upload.fileName).toBe('a[31mred "quoted".png');
    expect(await downloadedName(res.body.upload.url)).toBe('a[31mred "quoted".png');
  });

  it('deletes an upload and its file', async () => {
    const res = await upload(owner, TINY_PNG, 'gone.png').expect(201);
    const key = `uploads/${owner.user!.id}/${res.body.upload.id}.png`;
    expect(await storedBytes(key)).toBeDefined();
    await owner.del(`/api/patterns/${id}/uploads/${res.body.upload.id}`).expect(204);
    expect(await storedBytes(key)).toBeUndefined();
    await owner.get(res.body.upload.url).expect(404);
  });
});

describe('a reference image and the pattern it belongs to', () => {
  it('travels with a duplicate as its own file, and goes with the pattern deleted for good', async () => {
    const own = await owner.post('/api/patterns', { document: sampleDocument('Traced and copied') }).expect(201);
    const patternId: string = own.body.pattern.id;
    const image = Buffer.concat([TINY_PNG, Buffer.from('reference image bytes')]);
    const up = await owner.req('post', `/api/patterns/${patternId}/uploads`).attach('file', image, 'trace.png').expect(201);
    const referenceImage = { uploadId: up.body.upload.id, origin: { x: 0, y: 0 }, widthIn: 6, opacity: 0.4 };
    await owner.put(`/api/patterns/${patternId}`, { baseRevision: 1, document: { ...sampleDocument('Traced and copied'), referenceImage } }).expect(200);

    const copy = await owner.post(`/api/patterns/${patternId}/duplicate`, {}).expect(201);
    const copiedRef = copy.body.revision.document.referenceImage;
    expect(copiedRef.uploadId).not.toBe(up.body.upload.id);
    expect((await storedBytes(`uploads/${owner.user!.id}/${copiedRef.uploadId}.png`))?.equals(image)).toBe(true);

    const originalFile = `uploads/${owner.user!.id}/${up.body.upload.id}.png`;
    expect(await storedBytes(originalFile)).toBeDefined();
    await owner.post(`/api/patterns/${patternId}/trash`, {}).expect(200);
    await owner.del(`/api/patterns/${patternId}`).expect(204);
    expect(await storedBytes(originalFile)).toBeUndefined();
    // The copy's image is its own: deleting the original left it in place and served.
    const served = await owner.get(`/api/patterns/${copy.body.pattern.id}/uploads/${copiedRef.uploadId}/file`).buffer(true).expect(200);
    expect(Buffer.from(served.body).equals(image)).toBe(true);
  });
});
