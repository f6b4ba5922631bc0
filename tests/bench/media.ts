// `npm run bench:media`: a 12-megapixel JPEG through the product's image pipeline (type sniffing,
// metadata-stripping re-encode, three WebP sizes and a placeholder colour) against sharp called
// directly for the same outputs, in one run; then peak RSS with four uploads at once.
// Prints a table and writes .bench/media.json. Targets: within 1.3× of sharp direct; peak RSS < 400 MB
// (measured in a fresh child process, with MALLOC_ARENA_MAX=2 as is usual for libvips under glibc).
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import sharp from 'sharp';
import { inspectUpload } from '../../server/services/media/inspect';
import { cleanOriginal, makeVariants, variantWidths } from '../../server/services/media/pipeline';

const RUNS = Number(process.env.BENCH_RUNS ?? 5);

async function photo(): Promise<Buffer> {
  // 4000 × 3000 with noise, so the encoder has real work (a flat colour compresses to nothing).
  const noise = await sharp({
    create: { width: 4000, height: 3000, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 40 } },
  })
    .jpeg({ quality: 88 })
    .toBuffer();
  return sharp(noise)
    .withMetadata({ orientation: 1 })
    .withExif({ IFD0: { Make: 'Bench Camera' } })
    .jpeg({ quality: 88 })
    .toBuffer();
}

async function pipeline(bytes: Buffer): Promise<void> {
  const inspected = await inspectUpload(bytes, 'bench.jpg', 'photo');
  const clean = await cleanOriginal(bytes, inspected);
  await makeVariants(clean.bytes, (w) => `bench/w${w}.webp`);
}

async function direct(bytes: Buffer): Promise<void> {
  const original = await sharp(bytes).rotate().jpeg({ quality: 90, mozjpeg: true }).toBuffer();
  const { width = 1 } = await sharp(original).metadata();
  for (const w of variantWidths(width))
    await sharp(original).resize({ width: w, withoutEnlargement: true }).webp({ quality: 80 }).toBuffer();
  await sharp(original).resize(64).stats();
}

async function time(fn: () => Promise<void>): Promise<number> {
  const start = process.hrtime.bigint();
  await fn();
  return Number(process.hrtime.bigint() - start) / 1e6;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

async function main() {
  const bytes = await photo();
  await pipeline(bytes); // warm-up: libvips loads its codecs once
  await direct(bytes);
  const p: number[] = [];
  const d: number[] = [];
  // Interleaved, so both see the same machine load.
  for (let i = 0; i < RUNS; i += 1) {
    p.push(await time(() => pipeline(bytes)));
    d.push(await time(() => direct(bytes)));
  }
  // Peak memory in a fresh process that does nothing else: four uploads of the photo at once.
  const file = path.join(os.tmpdir(), `rr-bench-${process.pid}.jpg`);
  writeFileSync(file, bytes);
  const child = spawnSync(process.execPath, ['--import', 'tsx', fileURLToPath(import.meta.url), '--four-at-once', file], {
    encoding: 'utf8',
    env: { ...process.env, MALLOC_ARENA_MAX: process.env.MALLOC_ARENA_MAX ?? '2' },
  });
  rmSync(file, { force: true });
  const measured = JSON.parse(child.stdout.trim().split('\n').pop() ?? '{}') as { peak?: number; baseline?: number };
  const peak = measured.peak ?? Number.NaN;
  const baseline = measured.baseline ?? Number.NaN;

  const result = {
    date: new Date().toISOString(),
    image: { width: 4000, height: 3000, bytes: bytes.length },
    runs: RUNS,
    pipeline_ms: Math.round(median(p)),
    sharp_direct_ms: Math.round(median(d)),
    ratio: Number((median(p) / median(d)).toFixed(2)),
    ratio_target: 1.3,
    peak_rss_mb_four_at_once: Math.round(peak / 1024 / 1024),
    rss_before_mb: Math.round(baseline / 1024 / 1024),
    peak_rss_target_mb: 400,
  };
  console.log('media pipeline, 12-megapixel JPEG (median of runs)');
  console.table({
    'pipeline (ms)': result.pipeline_ms,
    'sharp direct (ms)': result.sharp_direct_ms,
    'ratio (target ≤ 1.3)': result.ratio,
    'peak RSS, 4 at once (MB, target < 400)': result.peak_rss_mb_four_at_once,
  });
  const out = path.resolve('.bench');
  mkdirSync(out, { recursive: true });
  writeFileSync(path.join(out, 'media.json'), JSON.stringify(result, null, 2));
  console.log(JSON.stringify(result));
}

/** The child: reads the photo, runs four pipelines at once, prints peak and starting RSS. */
async function fourAtOnce(file: string) {
  const bytes = readFileSync(file);
  const baseline = process.memoryUsage().rss;
  let peak = baseline;
  const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 5);
  await Promise.all([0, 1, 2, 3].map(() => pipeline(bytes)));
  clearInterval(sampler);
  peak = Math.max(peak, process.memoryUsage().rss);
  console.log(JSON.stringify({ peak, baseline }));
}

if (process.argv[2] === '--four-at-once') await fourAtOnce(process.argv[3]!);
else await main();
