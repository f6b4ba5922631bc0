// Media: what is accepted and refused, metadata stripped from every stored object, one object per
// content, variants by the job, photos served with long caching, receipts private, S3 faults.
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { crc32 } from 'node:zlib';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startS3Fake } from '../../fakes/s3';
import { sweepMedia } from '../../server/services/media/store';
import { addBuildMember, createOwnedBuild, signedInClient } from '../helpers/accounts';
import { createUser } from '../helpers/factories';
import type { TestClient } from '../helpers/http-client';
import { startTestApp, TEST_BUCKET, type TestApp } from '../helpers/test-app';
import os from 'node:os';
import path from 'node:path';
import { mkdtemp } from 'node:fs/promises';

let app: TestApp;
let owner: TestClient;
let follower: TestClient;
let buildId: number;
let privateBuildId: number;

beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
  const { build } = await createOwnedBuild(app.deps.db, { owner: { email: 'media-owner@example.test' }, build: { visibility: 'public' } });
  buildId = build.id;
  const priv = await createBuild2();
  privateBuildId = priv;
  await createUser(app.deps.db, { email: 'media-follower@example.test' });
  owner = await signedInClient(app, 'media-owner@example.test');
  follower = await signedInClient(app, 'media-follower@example.test');
});
afterAll(async () => {
  await app?.stop();
});

async function createBuild2(): Promise<number> {
  const { build } = await createOwnedBuild(app.deps.db, { build: { visibility: 'private' } });
  const u = await app.deps.db.selectFrom('users').select('id').where('email', '=', 'media-owner@example.test').executeTakeFirst();
  if (u) await addBuildMember(app.deps.db, build.id, u.id, 'editor');
  return build.id;
}

/** Sends a multipart upload with the client's session and CSRF token. */
async function upload(client: TestClient | null, bytes: Buffer, name: string, fields: Record<string, string> = {}, target = buildId) {
  const form = new FormData();
  form.set('kind', fields.kind ?? 'photo');
  if (fields.altText) form.set('altText', fields.altText);
  form.set('file', new Blob([new Uint8Array(bytes)]), name);
  const headers: Record<string, string> = { accept: 'application/json' };
  if (client) {
    headers.cookie = client.cookie!;
    headers['x-csrf-token'] = await (client as unknown as { csrfToken(): Promise<string> }).csrfToken();
  }
  const res = await fetch(`${app.baseUrl}/api/builds/${target}/media`, { method: 'POST', body: form, headers });
  return { status: res.status, body: (await res.json()) as Record<string, unknown> & { id: number; error?: { code: string } } };
}

async function objectKeys(prefix = ''): Promise<string[]> {
  const out = await app.deps.storage.client.send(new ListObjectsV2Command({ Bucket: TEST_BUCKET, Prefix: prefix }));
  return (out.Contents ?? []).map((o) => o.Key!).sort();
}

/** A JPEG 40 × 20 px with GPS coordinates and an EXIF orientation of 6 (shown rotated 90° clockwise). */
function jpegWithGps(): Promise<Buffer> {
  return sharp({ create: { width: 40, height: 20, channels: 3, background: { r: 160, g: 70, b: 40 } } })
    .jpeg()
    .withMetadata({ orientation: 6 })
    .withExif({
      IFD0: { Make: 'Invented Camera Co' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' },
    })
    .toBuffer();
}

/** A PNG whose header says 20 000 × 20 000 px (400 megapixels) in a few hundred bytes. */
async function pngBomb(): Promise<Buffer> {
  const png = Buffer.from(
    await sharp({ create: { width: 1, height: 1, channels: 3, background: '#000' } })
      .png()
      .toBuffer(),
  );
  // IHDR data starts at byte 16: width, height as big-endian uint32; its CRC covers type + data (bytes 12–28).
  png.writeUInt32BE(20_000, 16);
  png.writeUInt32BE(20_000, 20);
  png.writeUInt32BE(crc32(png.subarray(12, 29)) >>> 0, 29);
  return png;
}

describe('uploads', () => {
  it('stores a photo with no EXIF or GPS in any object, upright, and makes its sizes by the job', async () => {
    const original = await jpegWithGps();
    const sent = await sharp(original).metadata();
    // The test file really carries EXIF (the maker's name is its text marker) and an orientation of 6.
    expect(sent.exif).toBeDefined();
    expect(sent.orientation).toBe(6);
    expect(original.includes(Buffer.from('Invented Camera Co'))).toBe(true);
    const res = await upload(owner, original, 'garage.jpg', { altText: 'Caliper on the bench' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ kind: 'photo', status: 'processing', width: 20, height: 40, altText: 'Caliper on the bench' });
    expect(await app.runJobs()).toBeGreaterThan(0);
    const ready = await owner.get(`/api/media/${res.body.id}`);
    expect(ready.body.status).toBe('ready');
    expect(ready.body.srcset).toMatch(/^\/files\/\d+\/[0-9a-f]{64}\/w20\.webp 20w$/);
    const keys = await objectKeys(`builds/${buildId}/photo/`);
    expect(keys.length).toBe(2); // the cleaned original and one WebP (never upscaled past 20 px)
    for (const key of keys) {
      const bytes = await app.deps.storage.get(key);
      const meta = await sharp(bytes).metadata();
      expect(meta.exif, key).toBeUndefined();
      expect(meta.orientation ?? 1, key).toBe(1);
      expect(bytes.includes(Buffer.from('Invented Camera Co')), key).toBe(false);
      expect([meta.width, meta.height], key).toEqual([20, 40]);
    }
  });

  it('serves a public photo with long caching, falls back to the original while sizes are made, and hides private ones', async () => {
    const png = await sharp({ create: { width: 1200, height: 800, channels: 3, background: '#5a6b4c' } })
      .png()
      .toBuffer();
    const res = await upload(owner, png, 'wide.png');
    const meta = res.body as { id: number; src: string };
    // Before the job: the address of the original works.
    const early = await fetch(`${app.baseUrl}${meta.src}`);
    expect(early.status).toBe(200);
    await app.runJobs();
    const ready = (await owner.get(`/api/media/${res.body.id}`)).body as { srcset: string; src: string };
    expect(ready.srcset.split(', ').map((s) => s.split(' ')[1])).toEqual(['320w', '960w', '1200w']);
    const img = await fetch(`${app.baseUrl}${ready.src}`);
    expect(img.status).toBe(200);
    expect(img.headers.get('content-type')).toBe('image/webp');
    expect(img.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
    expect((await sharp(Buffer.from(await img.arrayBuffer())).metadata()).width).toBe(1200);
    expect((await fetch(`${app.baseUrl}${ready.src.replace(/\/[0-9a-f]{64}\//, `/${'0'.repeat(64)}/`)}`)).status).toBe(404);

    const hidden = await upload(owner, await jpegWithGps(), 'private.jpg', {}, privateBuildId);
    expect(hidden.status).toBe(201);
    expect((await fetch(`${app.baseUrl}${hidden.body.src as string}`)).status).toBe(404);
    const asTeam = await fetch(`${app.baseUrl}${hidden.body.src as string}`, { headers: { cookie: owner.cookie! } });
    expect(asTeam.status).toBe(200);
  });

  it('reads the type from the bytes: a PNG named .jpg is a PNG; HTML named .jpg and SVG are refused', async () => {
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#123456' } })
      .png()
      .toBuffer();
    const ok = await upload(owner, png, 'looks-like.jpg');
    expect(ok.status).toBe(201);
    expect(ok.body.contentType).toBe('image/png');
    const html = await upload(owner, Buffer.from('<!doctype html><script>alert(1)</script>'), 'cute.jpg');
    expect(html.status).toBe(415);
    expect(html.body.error?.code).toBe('unsupported_media_type');
    const svg = await upload(owner, Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 'icon.svg');
    expect(svg.status).toBe(415);
    const pngNamedHtml = await upload(owner, png, 'page.html');
    expect(pngNamedHtml.status).toBe(415);
    const pdfAsPhoto = await upload(owner, Buffer.from('%PDF-1.4\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n'), 'receipt.pdf');
    expect(pdfAsPhoto.status).toBe(415);
  });

  it('refuses a decompression bomb from its header, and oversize files with 413', async () => {
    const before = process.memoryUsage().rss;
    const bomb = await upload(owner, await pngBomb(), 'tiny.png');
    expect(bomb.status).toBe(413);
    expect(bomb.body.error?.code).toBe('image_too_large');
    // The 400-megapixel image was never decoded (it would need over a gigabyte).
    expect(process.memoryUsage().rss - before).toBeLessThan(200 * 1024 * 1024);
    const big = Buffer.alloc(26 * 1024 * 1024, 0);
    big.write('\xff\xd8\xff', 0, 'latin1');
    const oversize = await upload(owner, big, 'huge.jpg');
    expect(oversize.status).toBe(413);
    expect(oversize.body.error?.code).toBe('file_too_large');
  });

  it('stores the same file once', async () => {
    const png = await sharp({ create: { width: 9, height: 9, channels: 3, background: '#abcdef' } })
      .png()
      .toBuffer();
    const a = await upload(owner, png, 'a.png');
    const b = await upload(owner, png, 'b.png');
    expect(b.body.id).toBe(a.body.id);
    const rows = await app.deps.db
      .selectFrom('media')
      .select('id')
      .where('sha256', '=', (a.body.src as string).split('/')[3]!)
      .execute();
    expect(rows).toHaveLength(1);
  });
});

describe('receipts', () => {
  const pdf = Buffer.from('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n');

  it('are the build team’s alone: stored as-is, downloaded as an attachment, 404 for anyone else', async () => {
    const res = await upload(owner, pdf, 'invoice.pdf', { kind: 'receipt' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ kind: 'receipt', contentType: 'application/pdf', src: null });
    const dl = await fetch(`${app.baseUrl}/api/media/${res.body.id}/download`, { headers: { cookie: owner.cookie! } });
    expect(dl.status).toBe(200);
    expect(dl.headers.get('content-disposition')).toMatch(/^attachment;/);
    expect(Buffer.from(await dl.arrayBuffer()).equals(pdf)).toBe(true);
    for (const who of [follower, null]) {
      const headers: Record<string, string> = who ? { cookie: who.cookie! } : {};
      expect((await fetch(`${app.baseUrl}/api/media/${res.body.id}/download`, { headers })).status).toBe(404);
      expect((await fetch(`${app.baseUrl}/api/media/${res.body.id}`, { headers })).status).toBe(404);
    }
    const stranger = await upload(follower, pdf, 'mine.pdf', { kind: 'receipt' });
    expect(stranger.status).toBe(403);
  });
});

describe('faults and orphans', () => {
  it('answers 503 and keeps no row while S3 is down, and works again when it is back', async () => {
    const port = new URL(app.s3.url).port;
    await app.s3.stop();
    const png = await sharp({ create: { width: 7, height: 7, channels: 3, background: '#ff0000' } })
      .png()
      .toBuffer();
    const rowsBefore = await app.deps.db.selectFrom('media').select('id').execute();
    const down = await upload(owner, png, 'down.png');
    expect(down.status).toBe(503);
    expect(down.body.error?.code).toBe('storage_unavailable');
    expect(await app.deps.db.selectFrom('media').select('id').execute()).toHaveLength(rowsBefore.length);
    const dir = await mkdtemp(path.join(os.tmpdir(), 'rr-s3-again-'));
    const again = await startS3Fake({ port: Number(port), directory: dir, buckets: [TEST_BUCKET] });
    try {
      const up = await upload(owner, png, 'up.png');
      expect(up.status).toBe(201);
    } finally {
      Object.assign(app.s3, { stop: () => again.stop() });
    }
  });

  it('sweeps objects with no row after a day, and reports rows whose object is missing', async () => {
    await app.deps.storage.put(`builds/${buildId}/photo/${'f'.repeat(64)}/original.png`, Buffer.from('orphan'), 'image/png');
    const kept = await sweepMedia(app.deps);
    expect(kept.removed).toEqual([]);
    const swept = await sweepMedia(app.deps, Date.now() + 25 * 3600 * 1000);
    expect(swept.removed).toEqual([`builds/${buildId}/photo/${'f'.repeat(64)}/original.png`]);
    const row = await app.deps.db.selectFrom('media').select(['id', 'object_key']).where('kind', '=', 'photo').executeTakeFirstOrThrow();
    await app.deps.storage.remove(row.object_key);
    expect((await sweepMedia(app.deps)).missing).toContain(row.id);
  });

  it('deleting media removes its objects', async () => {
    const png = await sharp({ create: { width: 400, height: 300, channels: 3, background: '#00ff00' } })
      .png()
      .toBuffer();
    const res = await upload(owner, png, 'gone.png');
    await app.runJobs();
    const hash = (res.body.src as string).split('/')[3]!;
    expect((await objectKeys(`builds/${buildId}/photo/${hash}`)).length).toBeGreaterThan(1);
    expect((await owner.request('DELETE', `/api/media/${res.body.id}`)).status).toBe(204);
    expect(await objectKeys(`builds/${buildId}/photo/${hash}`)).toEqual([]);
  });
});

describe('pictures in the write-up', () => {
  it('renders a stored photo with srcset and alt, refuses other builds’ photos, and asks for alt text before publishing', async () => {
    const db = app.deps.db;
    const e = await db
      .insertInto('episodes')
      .values({
        build_id: buildId,
        number: 50,
        slug: 'pictures',
        title: 'Pictures',
        status: 'draft',
        write_up: JSON.stringify({ type: 'doc', content: [] }),
      })
      .returning(['id', 'version'])
      .executeTakeFirstOrThrow();
    const png = await sharp({ create: { width: 1000, height: 500, channels: 3, background: '#776655' } })
      .png()
      .toBuffer();
    const photo = await upload(owner, png, 'bench.png');
    const doc = (alt: string, mediaId = photo.body.id) => ({
      type: 'doc',
      content: [
        { type: 'paragraph', content: [{ type: 'text', text: 'The caliper, cleaned.' }] },
        { type: 'mediaImage', attrs: { mediaId, alt, src: photo.body.src } },
      ],
    });
    const saved = await owner.patch(`/api/episodes/${e.id}`, { version: e.version, writeUp: doc('') });
    expect(saved.status).toBe(200);
    expect(saved.body.writeUpHtml).toMatch(/<img src="\/files\/\d+\/[0-9a-f]{64}\/original\.png"/);
    const refused = await owner.post(`/api/episodes/${e.id}/publish`, { version: saved.body.version });
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toMatch(/alt text/);

    const other = await upload(owner, png, 'elsewhere.png', {}, privateBuildId);
    const foreign = await owner.patch(`/api/episodes/${e.id}`, { version: saved.body.version, writeUp: doc('x', other.body.id) });
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.fields).toHaveProperty('writeUp');

    const withAlt = await owner.patch(`/api/episodes/${e.id}`, { version: saved.body.version, writeUp: doc('Caliper body on the bench') });
    expect(withAlt.status).toBe(200);
    await app.runJobs();
    const html = (await db.selectFrom('episodes').select('write_up_html').where('id', '=', e.id).executeTakeFirstOrThrow()).write_up_html;
    expect(html).toMatch(
      /srcset="\/files\/\d+\/[0-9a-f]{64}\/w320\.webp 320w, \/files\/\d+\/[0-9a-f]{64}\/w960\.webp 960w, \/files\/\d+\/[0-9a-f]{64}\/w1000\.webp 1000w"/,
    );
    expect(html).toContain('alt="Caliper body on the bench"');
    expect(html).toContain('width="1000" height="500"');
    const published = await owner.post(`/api/episodes/${e.id}/publish`, { version: withAlt.body.version });
    expect(published.status).toBe(200);
    // The first picture of the write-up is the episode's cover on the front page, at its 960 px size.
    const latest = await follower.get('/api/episodes');
    const card = latest.body.items.find((i: { id: number }) => i.id === e.id);
    expect(card.coverUrl).toMatch(/^\/files\/\d+\/[0-9a-f]{64}\/w960\.webp$/);
    expect((await fetch(`${app.baseUrl}${card.coverUrl}`)).status).toBe(200);
  });
});

describe('covers and the episode gallery', () => {
  it('sets an episode cover and gallery from the build’s photos, asks for alt text, and shows them to readers', async () => {
    const db = app.deps.db;
    const e = await db
      .insertInto('episodes')
      .values({
        build_id: buildId,
        number: 70,
        slug: 'gallery',
        title: 'Gallery',
        status: 'draft',
        write_up: JSON.stringify({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Sanded.' }] }] }),
      })
      .returning(['id', 'version'])
      .executeTakeFirstOrThrow();
    const png = (colour: string) =>
      sharp({ create: { width: 800, height: 600, channels: 3, background: colour } })
        .png()
        .toBuffer();
    const a = await upload(owner, await png('#224466'), 'a.png', { altText: 'Door skin after sanding' });
    const b = await upload(owner, await png('#664422'), 'b.png');
    const foreign = await upload(owner, await png('#446622'), 'c.png', { altText: 'Elsewhere' }, privateBuildId);
    await app.runJobs();

    // The build's photos list has both, newest first; receipts are not photos.
    const photos = await owner.get(`/api/builds/${buildId}/photos?perPage=60`);
    expect(photos.status).toBe(200);
    const ids = photos.body.items.map((m: { id: number }) => m.id);
    expect(ids).toEqual(expect.arrayContaining([a.body.id, b.body.id]));
    expect(ids).not.toContain(foreign.body.id);
    expect(photos.body.items.every((m: { kind: string }) => m.kind === 'photo')).toBe(true);

    // Another build's photo, a duplicate and a non-number are refused, naming the field; nothing changes.
    const bad = await owner.put(`/api/episodes/${e.id}/pictures`, { coverMediaId: foreign.body.id, gallery: [a.body.id, a.body.id] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['gallery.1']);
    const bad2 = await owner.put(`/api/episodes/${e.id}/pictures`, { coverMediaId: foreign.body.id, gallery: [a.body.id] });
    expect(bad2.status).toBe(400);
    expect(Object.keys(bad2.body.error.fields)).toEqual(['coverMediaId']);
    expect((await owner.get(`/api/episodes/${e.id}/pictures`)).body).toEqual({ cover: null, gallery: [] });

    // A draft may hold an undescribed picture; publishing then names it.
    const set = await owner.put(`/api/episodes/${e.id}/pictures`, { coverMediaId: a.body.id, gallery: [b.body.id, a.body.id] });
    expect(set.status).toBe(200);
    expect(set.body.cover.id).toBe(a.body.id);
    expect(set.body.gallery.map((m: { id: number }) => m.id)).toEqual([b.body.id, a.body.id]);
    const refused = await owner.post(`/api/episodes/${e.id}/publish`, { version: e.version });
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields).toHaveProperty('gallery');
    expect(refused.body.error.fields).not.toHaveProperty('cover');

    expect((await owner.patch(`/api/media/${b.body.id}`, { altText: 'Primer on the sill' })).status).toBe(200);
    const published = await owner.post(`/api/episodes/${e.id}/publish`, { version: e.version });
    expect(published.status).toBe(200);

    // Once public, an undescribed picture is refused at once.
    const c = await upload(owner, await png('#888888'), 'd.png');
    const late = await owner.put(`/api/episodes/${e.id}/pictures`, { coverMediaId: a.body.id, gallery: [c.body.id] });
    expect(late.status).toBe(400);
    expect(late.body.error.fields['gallery.0'][0]).toMatch(/alt text/);

    const reading = await follower.get(`/api/episodes/${e.id}/reading`);
    expect(reading.status).toBe(200);
    expect(reading.body.cover).toMatchObject({ id: a.body.id, alt: 'Door skin after sanding', width: 800, height: 600 });
    expect(reading.body.cover.srcset).toMatch(/w320\.webp 320w, .*w800\.webp 800w$/);
    expect(reading.body.gallery.map((g: { id: number; alt: string }) => [g.id, g.alt])).toEqual([
      [b.body.id, 'Primer on the sill'],
      [a.body.id, 'Door skin after sanding'],
    ]);
    // Followers cannot edit pictures; the chosen cover is also the front page card's picture.
    expect((await follower.put(`/api/episodes/${e.id}/pictures`, { coverMediaId: null, gallery: [] })).status).toBe(403);
    const card = (await follower.get('/api/episodes')).body.items.find((i: { id: number }) => i.id === e.id);
    expect(card.coverUrl).toContain(`/files/${a.body.id}/`);

    // Deleting a photo takes it out of the gallery and the cover.
    expect((await owner.delete(`/api/media/${a.body.id}`)).status).toBe(204);
    const after = await owner.get(`/api/episodes/${e.id}/pictures`);
    expect(after.body.cover).toBeNull();
    expect(after.body.gallery.map((m: { id: number }) => m.id)).toEqual([b.body.id]);
  });

  it('lets the owner choose a described photo as the build cover, shown on the build page', async () => {
    const png = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#335577' } })
      .png()
      .toBuffer();
    const plain = await upload(owner, png, 'cover.png');
    const refused = await owner.put(`/api/builds/${buildId}/cover`, { coverMediaId: plain.body.id });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toHaveProperty('coverMediaId');
    expect((await owner.patch(`/api/media/${plain.body.id}`, { altText: 'The car under a dust sheet' })).status).toBe(200);
    await app.runJobs();
    const set = await owner.put(`/api/builds/${buildId}/cover`, { coverMediaId: plain.body.id });
    expect(set.status).toBe(200);
    expect(set.body.cover.id).toBe(plain.body.id);
    const overview = await follower.get(`/api/builds/${buildId}/overview`);
    expect(overview.body.cover).toMatchObject({ id: plain.body.id, alt: 'The car under a dust sheet', width: 640 });
    expect((await owner.put(`/api/builds/${buildId}/cover`, { coverMediaId: null })).body).toEqual({ cover: null });
    expect((await follower.get(`/api/builds/${buildId}/overview`)).body.cover).toBeNull();
  });
});

describe('receipts on part lines', () => {
  it('attaches a receipt to a line, filters the ledger by it, and hides it from readers', async () => {
    const db = app.deps.db;
    const e = await db
      .insertInto('episodes')
      .values({
        build_id: buildId,
        number: 60,
        slug: 'receipts',
        title: 'Receipts',
        status: 'published',
        published_at: new Date(Date.now() - 60_000),
        write_up: '{"type":"doc"}',
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const currency = (await db.selectFrom('builds').select('currency').where('id', '=', buildId).executeTakeFirstOrThrow()).currency;
    const line = await owner.post(`/api/episodes/${e.id}/part-lines`, {
      kind: 'part',
      description: 'Door seal',
      currency,
      unitPriceMinor: 1500,
    });
    const other = await owner.post(`/api/episodes/${e.id}/part-lines`, {
      kind: 'part',
      description: 'Door pins',
      currency,
      unitPriceMinor: 400,
    });
    const receipt = await upload(owner, Buffer.from('%PDF-1.4\n%%EOF\n'), 'till-slip.pdf', { kind: 'receipt' });
    const photo = await upload(
      owner,
      await sharp({ create: { width: 5, height: 5, channels: 3, background: '#010203' } })
        .png()
        .toBuffer(),
      'x.png',
    );
    const wrong = await owner.patch(`/api/part-lines/${line.body.id}`, { receiptMediaId: photo.body.id });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty('receiptMediaId');
    const attached = await owner.patch(`/api/part-lines/${line.body.id}`, { receiptMediaId: receipt.body.id });
    expect(attached.status).toBe(200);
    expect(attached.body.receipt).toEqual({ id: receipt.body.id, contentType: 'application/pdf' });
    const missing = await owner.get(`/api/builds/${buildId}/ledger?receipt=missing&episodeId=${e.id}`);
    expect(missing.body.items.map((l: { id: number }) => l.id)).toEqual([other.body.id]);
    const withReceipt = await owner.get(`/api/builds/${buildId}/ledger?receipt=attached&episodeId=${e.id}`);
    expect(withReceipt.body.items.map((l: { id: number }) => l.id)).toEqual([line.body.id]);
    const asReader = await follower.get(`/api/episodes/${e.id}/part-lines`);
    expect(asReader.body.items.every((l: { receipt: unknown }) => l.receipt === null)).toBe(true);
  });
});
