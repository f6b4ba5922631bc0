import type { Transaction } from 'kysely';
import sharp from 'sharp';
import type { Storage } from '../../adapters/storage';
import type { Database } from '../../db/database';
import { inspectUpload, type MediaKind } from '../../services/media/inspect';
import { cleanOriginal, makeVariants, sha256 } from '../../services/media/pipeline';
import { mediaPrefix } from '../../services/media/store';
import type { SeedSection } from '../section';

// Demo photos drawn by code: flat shapes on plain grounds, standing in for workshop photos. No real
// vehicles, people, brands or places; every picture is described (alt text) as readers would need.

const W = 1200;
const H = 900;
const ground = (fill: string, floor: string) =>
  `<rect width="${W}" height="${H}" fill="${fill}"/><rect y="${H * 0.72}" width="${W}" height="${H * 0.28}" fill="${floor}"/>`;
const wheel = (cx: number, cy: number, r: number) =>
  `<circle cx="${cx}" cy="${cy}" r="${r}" fill="#1d1f21"/><circle cx="${cx}" cy="${cy}" r="${r * 0.55}" fill="#8a8f93"/>` +
  `<circle cx="${cx}" cy="${cy}" r="${r * 0.14}" fill="#3a3d40"/>`;
const svg = (body: string) => Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}">${body}</svg>`);

interface DemoPhoto {
  key: string;
  alt: string;
  draw: () => Buffer;
}

const PHOTOS: Record<string, DemoPhoto> = {
  hatchback: {
    key: 'hatchback',
    alt: 'A faded teal hatchback parked on a concrete floor, its paint dull and the rear bumper missing',
    draw: () =>
      svg(
        ground('#c9c3b6', '#8d8a84') +
          `<path d="M180 620 L220 470 Q260 390 380 380 L700 370 Q800 372 860 450 L1010 480 Q1060 500 1060 560 L1060 620 Z" fill="#4f8a86"/>` +
          `<path d="M300 470 L350 405 L560 400 L560 470 Z" fill="#cfe3e6"/><path d="M590 400 L700 398 Q760 402 800 470 L590 470 Z" fill="#cfe3e6"/>` +
          wheel(330, 630, 85) +
          wheel(900, 630, 85),
      ),
  },
  trailer: {
    key: 'trailer',
    alt: 'The hatchback strapped onto a flat car trailer at dusk, tow strap across the front',
    draw: () =>
      svg(
        ground('#5b5f77', '#3f3e44') +
          `<rect x="120" y="600" width="960" height="40" fill="#6b6e70"/>` +
          wheel(420, 665, 55) +
          wheel(560, 665, 55) +
          `<path d="M220 590 L250 480 Q280 420 380 414 L680 408 Q770 410 820 470 L940 494 Q980 510 980 560 L980 590 Z" fill="#4f8a86"/>` +
          `<rect x="560" y="470" width="14" height="130" fill="#d98b2b"/>`,
      ),
  },
  disc: {
    key: 'disc',
    alt: 'A front brake disc off the car on the bench, scored and rusty at its outer edge',
    draw: () =>
      svg(
        ground('#d7d2c8', '#9a7b5a') +
          `<circle cx="600" cy="450" r="300" fill="#7b4a32"/><circle cx="600" cy="450" r="250" fill="#9da3a6"/>` +
          `<circle cx="600" cy="450" r="110" fill="#5c6064"/><circle cx="600" cy="450" r="45" fill="#d7d2c8"/>` +
          [0, 72, 144, 216, 288]
            .map((a) => {
              const r = (a * Math.PI) / 180;
              return `<circle cx="${600 + 78 * Math.cos(r)}" cy="${450 + 78 * Math.sin(r)}" r="12" fill="#d7d2c8"/>`;
            })
            .join(''),
      ),
  },
  pistons: {
    key: 'pistons',
    alt: 'Two caliper pistons and their new seals laid out on a clean cloth',
    draw: () =>
      svg(
        ground('#e4e0d6', '#e4e0d6') +
          `<rect x="150" y="250" width="900" height="420" fill="#f4f1ea" stroke="#c8c1b2" stroke-width="6"/>` +
          `<circle cx="420" cy="460" r="120" fill="#b9bec2"/><circle cx="420" cy="460" r="90" fill="#d5d9dc"/>` +
          `<circle cx="780" cy="460" r="120" fill="#b9bec2"/><circle cx="780" cy="460" r="90" fill="#d5d9dc"/>` +
          `<circle cx="600" cy="330" r="48" fill="none" stroke="#2f2f2f" stroke-width="10"/>`,
      ),
  },
  bench: {
    key: 'bench',
    alt: 'The workbench with the cleaned caliper body, a torque wrench and a tin of brake cleaner',
    draw: () =>
      svg(
        ground('#cfc8b8', '#6e5138') +
          `<rect x="100" y="560" width="1000" height="60" fill="#8a623f"/>` +
          `<rect x="230" y="440" width="220" height="120" rx="18" fill="#7d8589"/>` +
          `<rect x="520" y="520" width="420" height="22" rx="11" fill="#2f3336"/><circle cx="950" cy="531" r="30" fill="#2f3336"/>` +
          `<rect x="980" y="410" width="80" height="150" fill="#b8322a"/>`,
      ),
  },
  radiator: {
    key: 'radiator',
    alt: 'The radiator out of the car, its fins bent in one corner, standing against the wall',
    draw: () =>
      svg(
        ground('#d3cfc4', '#8d8a84') +
          `<rect x="300" y="180" width="600" height="500" fill="#3b3f42"/>` +
          Array.from({ length: 24 }, (_, i) => `<rect x="${320 + i * 24}" y="200" width="8" height="460" fill="#6c7276"/>`).join('') +
          `<rect x="300" y="150" width="600" height="40" fill="#7a5a2a"/><rect x="300" y="670" width="600" height="40" fill="#7a5a2a"/>`,
      ),
  },
  trailBike: {
    key: 'trail-bike',
    alt: 'A small red trail bike on its side stand, tank dented and the seat cover split',
    draw: () =>
      svg(
        ground('#cbd2c4', '#7f7a6d') +
          wheel(330, 620, 120) +
          wheel(880, 620, 120) +
          `<path d="M330 620 L520 430 L760 430 L880 620" fill="none" stroke="#a3302b" stroke-width="26"/>` +
          `<rect x="500" y="360" width="230" height="70" rx="30" fill="#a3302b"/><rect x="700" y="350" width="180" height="36" rx="14" fill="#2b2b2b"/>`,
      ),
  },
  barrel: {
    key: 'barrel',
    alt: 'The cylinder barrel off the engine, cooling fins coated in old oil and grit',
    draw: () =>
      svg(
        ground('#d9d4c6', '#9a7b5a') +
          Array.from({ length: 9 }, (_, i) => `<rect x="380" y="${220 + i * 50}" width="440" height="26" rx="6" fill="#8c8f8f"/>`).join(
            '',
          ) +
          `<rect x="520" y="200" width="160" height="480" fill="#5e6162"/><ellipse cx="600" cy="200" rx="80" ry="24" fill="#2d2f30"/>`,
      ),
  },
  piston: {
    key: 'piston',
    alt: 'The piston with carbon on its crown and a scuffed skirt, held up against the light',
    draw: () =>
      svg(
        ground('#efe9dc', '#efe9dc') +
          `<rect x="430" y="260" width="340" height="380" rx="26" fill="#c4c7c9"/><rect x="430" y="260" width="340" height="60" rx="20" fill="#3c3a37"/>` +
          `<rect x="430" y="345" width="340" height="10" fill="#6f7274"/><rect x="430" y="375" width="340" height="10" fill="#6f7274"/>` +
          `<circle cx="600" cy="500" r="40" fill="#8e9193"/>`,
      ),
  },
};

/** Which photos go where: build covers, episode covers and galleries (by episode number). */
const PLAN: Record<string, { cover: string; episodes: Record<number, { cover?: string; gallery?: string[] }> }> = {
  'marlowe-pipit-1976': {
    cover: 'hatchback',
    episodes: {
      1: { cover: 'trailer' },
      2: { cover: 'disc', gallery: ['disc', 'pistons', 'bench'] },
      3: { cover: 'radiator' },
    },
  },
  'vantel-125-trail': {
    cover: 'trailBike',
    episodes: { 1: { cover: 'barrel', gallery: ['barrel', 'piston'] } },
  },
};

/** The one demo receipt: a PDF for the caliper seal kit, from an invented supplier. */
const RECEIPT = { build: 'marlowe-pipit-1976', episode: 2, description: 'Caliper seal kit, 48 mm' };

/** A one-page PDF with a few lines of text in a standard font (no embedding needed); offsets worked out here. */
export function receiptPdf(lines: string[]): Buffer {
  const esc = (t: string) => t.replace(/[\\()]/g, (c) => `\\${c}`);
  const text = lines.map((l, i) => `BT /F1 14 Tf 72 ${760 - i * 22} Td (${esc(l)}) Tj ET`).join('\n');
  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Contents 4 0 R /Resources << /Font << /F1 5 0 R >> >> >>',
    `<< /Length ${Buffer.byteLength(text)} >>\nstream\n${text}\nendstream`,
    '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>',
  ];
  let out = '%PDF-1.4\n';
  const offsets: number[] = [];
  objects.forEach((o, i) => {
    offsets.push(Buffer.byteLength(out));
    out += `${i + 1} 0 obj\n${o}\nendobj\n`;
  });
  const xref = Buffer.byteLength(out);
  out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`;
  out += offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n \n`).join('');
  out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return Buffer.from(out, 'latin1');
}

/**
 * Stores one file the way an upload is stored (type read from the bytes, metadata stripped, key from the
 * content under the build's prefix) with its sizes made at once; an existing row is reused.
 */
async function storeDemoFile(
  trx: Transaction<Database>,
  storage: Storage,
  buildId: number,
  kind: MediaKind,
  bytes: Buffer,
  name: string,
  alt: string | null,
): Promise<number> {
  const hash = sha256(bytes);
  const existing = await trx
    .selectFrom('media')
    .select('id')
    .where('build_id', '=', buildId)
    .where('kind', '=', kind)
    .where('sha256', '=', hash)
    .executeTakeFirst();
  if (existing) return existing.id;
  const inspected = await inspectUpload(bytes, name, kind);
  const base = mediaPrefix({ buildId }, kind, hash);
  if (kind === 'receipt') {
    const key = `${base}/original.${inspected.ext}`;
    await storage.put(key, bytes, inspected.mime);
    const row = await trx
      .insertInto('media')
      .values({
        build_id: buildId,
        kind,
        sha256: hash,
        object_key: key,
        content_type: inspected.mime,
        size_bytes: bytes.length,
        status: 'ready',
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return row.id;
  }
  const clean = await cleanOriginal(bytes, inspected);
  const key = `${base}/original.${clean.ext}`;
  await storage.put(key, clean.bytes, clean.contentType);
  const { variants, placeholder } = await makeVariants(clean.bytes, (w) => `${base}/w${w}.webp`);
  for (const v of variants) await storage.put(v.key, v.bytes, 'image/webp');
  const row = await trx
    .insertInto('media')
    .values({
      build_id: buildId,
      kind,
      sha256: hash,
      object_key: key,
      content_type: clean.contentType,
      size_bytes: clean.bytes.length,
      width: clean.width,
      height: clean.height,
      alt_text: alt,
      placeholder,
      status: 'ready',
      variants: JSON.stringify(variants.map(({ width, height, key: k }) => ({ width, height, key: k }))),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

/** Photos for the demo builds' covers and galleries, and one receipt; choices the creator changed are kept. */
export const demoPhotosSection: SeedSection = {
  key: 'demo-photos',
  version: 1,
  needsStorage: true,
  async run(trx, { storage }) {
    if (!storage) return;
    const jpegs = new Map<string, Buffer>();
    const jpeg = async (name: string) => {
      if (!jpegs.has(name)) jpegs.set(name, await sharp(PHOTOS[name]!.draw()).jpeg({ quality: 85 }).toBuffer());
      return jpegs.get(name)!;
    };
    for (const [slug, plan] of Object.entries(PLAN)) {
      const build = await trx.selectFrom('builds').select(['id', 'cover_media_id']).where('slug', '=', slug).executeTakeFirst();
      if (!build) continue;
      const photo = async (name: string) =>
        storeDemoFile(trx, storage, build.id, 'photo', await jpeg(name), `${PHOTOS[name]!.key}.jpg`, PHOTOS[name]!.alt);
      const cover = await photo(plan.cover);
      if (build.cover_media_id === null)
        await trx.updateTable('builds').set({ cover_media_id: cover }).where('id', '=', build.id).execute();
      for (const [number, pics] of Object.entries(plan.episodes)) {
        const episode = await trx
          .selectFrom('episodes')
          .select(['id', 'cover_media_id'])
          .where('build_id', '=', build.id)
          .where('number', '=', Number(number))
          .executeTakeFirst();
        if (!episode) continue;
        if (pics.cover && episode.cover_media_id === null) {
          const id = await photo(pics.cover);
          await trx.updateTable('episodes').set({ cover_media_id: id }).where('id', '=', episode.id).execute();
        }
        const hasGallery = await trx.selectFrom('episode_gallery').select('id').where('episode_id', '=', episode.id).executeTakeFirst();
        if (pics.gallery && !hasGallery) {
          const ids: number[] = [];
          for (const name of pics.gallery) ids.push(await photo(name));
          await trx
            .insertInto('episode_gallery')
            .values(ids.map((media_id, position) => ({ episode_id: episode.id, media_id, position })))
            .execute();
        }
      }
      if (slug === RECEIPT.build) {
        const line = await trx
          .selectFrom('part_lines as l')
          .innerJoin('episodes as e', 'e.id', 'l.episode_id')
          .select(['l.id', 'l.receipt_media_id'])
          .where('l.build_id', '=', build.id)
          .where('e.number', '=', RECEIPT.episode)
          .where('l.description', '=', RECEIPT.description)
          .executeTakeFirst();
        if (line && line.receipt_media_id === null) {
          const pdf = receiptPdf([
            'Quillon Brake Supply (invented demo supplier)',
            'Receipt 0042 - demo data',
            '2 x Caliper seal kit, 48 mm, QB-SK-48 at 14.40 ..... 28.80',
            'VAT 20 % ............................................ 5.76',
            'Total .............................................. 34.56 EUR',
          ]);
          const id = await storeDemoFile(trx, storage, build.id, 'receipt', pdf, 'receipt-0042.pdf', null);
          await trx.updateTable('part_lines').set({ receipt_media_id: id }).where('id', '=', line.id).execute();
        }
      }
    }
  },
};
