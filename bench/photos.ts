/**
 * What a photo upload costs the server, before and after the changes for issue 8 §4, side by side in
 * one run: the earlier preparation (a 60-megapixel limit enforced by decoding, and the original
 * decoded twice, once per copy) against `preparePhoto` today (a 24-megapixel limit read from the
 * header, one decode for both copies). Prints time per photo and the ratio; no pass/fail.
 *
 *   npx tsx bench/photos.ts
 */
import sharp from 'sharp';
import zlib from 'node:zlib';
import { FULL_SIZE_PX, preparePhoto, THUMB_SIZE_PX } from '../server/modules/photos/photo-files';

/** The preparation as it was: decode, resize and encode the full copy; decode again for the thumbnail. */
async function earlierPrepare(buffer: Buffer) {
  const source = () => sharp(buffer, { limitInputPixels: 60_000_000, failOn: 'error' }).rotate();
  const full = await source().resize({ width: FULL_SIZE_PX, height: FULL_SIZE_PX, fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 86, mozjpeg: true }).toBuffer();
  const thumb = await source().resize({ width: THUMB_SIZE_PX, height: THUMB_SIZE_PX, fit: 'inside', withoutEnlargement: true }).webp({ quality: 72 }).toBuffer();
  return { full, thumb };
}

async function timeEach(label: string, rounds: number, work: () => Promise<unknown>): Promise<number> {
  await work().catch(() => undefined); // warm up
  const t0 = process.hrtime.bigint();
  for (let i = 0; i < rounds; i++) await work().catch(() => undefined);
  const ms = Number(process.hrtime.bigint() - t0) / 1e6 / rounds;
  console.log(`  ${label.padEnd(44)} ${ms.toFixed(1).padStart(8)} ms`);
  return ms;
}

/** A phone-sized photo with some texture, so the encoder has real work. */
async function phonePhoto(): Promise<Buffer> {
  const w = 4032;
  const h = 3024;
  const raw = Buffer.alloc(w * h * 3);
  for (let i = 0; i < raw.length; i++) raw[i] = (i * 2654435761) >>> 24;
  return sharp(raw, { raw: { width: w, height: h, channels: 3 } }).blur(1.2).jpeg({ quality: 90 }).toBuffer();
}

/** A uniform 7,740 × 7,740 PNG: small on disk, 60 megapixels once decoded (the shape of the reported file). */
async function lyingPng(): Promise<Buffer> {
  const png = Buffer.from(await sharp({ create: { width: 8, height: 8, channels: 3, background: '#8c6eaa' } }).png().toBuffer());
  png.writeUInt32BE(7740, 16);
  png.writeUInt32BE(7740, 20);
  png.writeUInt32BE(zlib.crc32(png.subarray(12, 29)) >>> 0, 29);
  return png;
}
async function realBigPng(): Promise<Buffer> {
  return sharp({ create: { width: 7740, height: 7740, channels: 3, background: '#8c6eaa' } }).png({ compressionLevel: 9 }).toBuffer();
}

const file = (buffer: Buffer, name: string) => ({ originalname: name, size: buffer.length, buffer });

const photo = await phonePhoto();
console.log(`A 12-megapixel phone photo (4032 × 3024, ${(photo.length / 1e6).toFixed(1)} MB JPEG), 5 rounds each:`);
const before = await timeEach('earlier: decoded twice', 5, () => earlierPrepare(photo));
const after = await timeEach('now: decoded once', 5, () => preparePhoto(file(photo, 'a.jpg'), 0));
console.log(`  ratio now / earlier: ${(after / before).toFixed(2)}×\n`);

const big = await realBigPng();
const lie = await lyingPng();
console.log(`A 7,740 × 7,740 PNG (${(big.length / 1e3).toFixed(0)} KB real, ${lie.length} bytes with a lying header), 3 rounds each:`);
const bigBefore = await timeEach('earlier: real 60 MP canvas decoded', 3, () => earlierPrepare(big));
const bigAfter = await timeEach('now: refused from its header', 3, () => preparePhoto(file(big, 'b.png'), 0));
console.log(`  ratio now / earlier: ${(bigAfter / bigBefore).toFixed(3)}×`);
const rss = process.memoryUsage().rss / 1024 / 1024;
console.log(`\nRSS at the end: ${rss.toFixed(0)} MB (both variants ran in this process).`);
