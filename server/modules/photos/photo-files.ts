import fs from 'node:fs/promises';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import type Sharp from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import { HttpError } from '../../lib/http-error';
import { PHOTO_MIME_TYPES, type PhotoMime } from '@shared/schemas/blanket-log';

let sharpModule: Promise<typeof Sharp> | undefined;
/** sharp (libvips) is loaded on the first photo rather than at start: loading it costs every start ~150 ms. */
export const loadSharp = (): Promise<typeof Sharp> => (sharpModule ??= import('sharp').then((m) => m.default));

/** Photos live in their own folder under UPLOAD_DIR, outside anything served statically. */
export const PHOTO_FOLDER = 'photos';
export const THUMB_SIZE_PX = 320;
/** Longest side we keep of the full photo: enough to see stitches, small enough to load on a phone. */
export const FULL_SIZE_PX = 2560;
/**
 * The largest photo we open: 24 megapixels, twice what a phone's camera saves by default (12 MP, the
 * larger sensors bin their pixels down to it), so any ordinary phone photo fits and a small file that
 * claims a huge canvas (a decompression bomb) is refused from its header, before any decoding.
 */
export const MAX_INPUT_PIXELS = 24_000_000;

const EXTENSION: Record<PhotoMime, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' };
const STORED_NAME = /^[a-f0-9]{32}(-thumb)?\.(jpg|png|webp)$/;

export interface IncomingFile {
  originalname: string;
  size: number;
  buffer: Buffer;
}

export interface PreparedPhoto {
  full: Buffer;
  thumb: Buffer;
  mime: PhotoMime;
  width: number;
  height: number;
}

const photoError = (status: number, message: string) => new HttpError(status, `photos: ${message}`, [{ path: 'photos', message }]);

/** The file as the user knows it, for messages: its position, and its name without any folder. */
function which(file: IncomingFile, index: number): string {
  const base = file.originalname.split(/[\\/]/).pop()?.slice(0, 60) ?? '';
  return base ? `photo ${index + 1} (${base})` : `photo ${index + 1}`;
}

/**
 * Checks one uploaded file and makes the two copies we keep. The type comes from the bytes, never
 * from the name or the Content-Type the browser sent (OWASP File Upload). The full copy is
 * re-encoded, turned upright and stripped of metadata, so a phone's GPS position in the EXIF
 * block does not travel with a photo of someone's sofa.
 */
export async function preparePhoto(file: IncomingFile, index: number): Promise<PreparedPhoto> {
  // The client's name is never used for storage; a folder in it is still a sign of a tampered request.
  if (/[\\/]|\.\.|\0/.test(file.originalname)) {
    throw photoError(400, `${which(file, index)} has a folder path in its file name; send the file on its own`);
  }
  if (file.size === 0 || file.buffer.length === 0) throw photoError(400, `${which(file, index)} is empty`);
  const type = await fileTypeFromBuffer(file.buffer);
  if (!type || !(PHOTO_MIME_TYPES as readonly string[]).includes(type.mime)) {
    throw photoError(415, `${which(file, index)} is not a JPEG, PNG or WebP image${type ? ` (its content is ${type.mime})` : ''}`);
  }
  const mime = type.mime as PhotoMime;
  // The header alone says how big the picture claims to be; a lying file is refused here, unopened.
  const sharp = await loadSharp();
  let declared: { width?: number; height?: number };
  try {
    declared = await sharp(file.buffer).metadata();
  } catch {
    throw photoError(400, `${which(file, index)} could not be read as an image; it may be damaged`);
  }
  if (!declared.width || !declared.height) throw photoError(400, `${which(file, index)} does not say how big it is; it may be damaged`);
  if (declared.width * declared.height > MAX_INPUT_PIXELS) {
    const mp = Math.round((declared.width * declared.height) / 1e6);
    throw photoError(
      400,
      `${which(file, index)} is ${declared.width} × ${declared.height} pixels (${mp} megapixels); photos up to ${MAX_INPUT_PIXELS / 1e6} megapixels are taken, which is more than a phone camera's usual setting`,
    );
  }
  try {
    // The original is decoded and resized once, to the copy we keep; the thumbnail is made from that
    // copy, which is a fraction of the original's size, rather than from the original again.
    const resized = sharp(file.buffer, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' })
      .rotate()
      .resize({ width: FULL_SIZE_PX, height: FULL_SIZE_PX, fit: 'inside', withoutEnlargement: true });
    const encoded = mime === 'image/jpeg' ? resized.jpeg({ quality: 86, mozjpeg: true }) : mime === 'image/png' ? resized.png() : resized.webp({ quality: 86 });
    const { data: full, info } = await encoded.toBuffer({ resolveWithObject: true });
    const thumb = await sharp(full).resize({ width: THUMB_SIZE_PX, height: THUMB_SIZE_PX, fit: 'inside', withoutEnlargement: true }).webp({ quality: 72 }).toBuffer();
    return { full, thumb, mime, width: info.width, height: info.height };
  } catch {
    throw photoError(400, `${which(file, index)} could not be read as an image; it may be damaged`);
  }
}

export const photoDir = (uploadDir: string) => path.join(uploadDir, PHOTO_FOLDER);

export interface StoredNames {
  fileName: string;
  thumbName: string;
}

/**
 * Writes both copies under generated names and reports every path it wrote, even when it fails
 * half-way, so the caller can remove them all.
 */
export async function writePhoto(uploadDir: string, photo: PreparedPhoto, written: string[]): Promise<StoredNames> {
  const dir = photoDir(uploadDir);
  await fs.mkdir(dir, { recursive: true });
  const base = randomBytes(16).toString('hex');
  const names = { fileName: `${base}.${EXTENSION[photo.mime]}`, thumbName: `${base}-thumb.webp` };
  for (const [name, data] of [
    [names.fileName, photo.full],
    [names.thumbName, photo.thumb],
  ] as const) {
    const target = path.join(dir, name);
    written.push(target);
    // 'wx' refuses to overwrite: a clash of 128-bit names would be a bug, not something to paper over.
    await fs.writeFile(target, data, { flag: 'wx' });
  }
  return names;
}

export async function removeFiles(paths: string[]): Promise<void> {
  await Promise.all(paths.map((p) => fs.rm(p, { force: true })));
}

/** The absolute path of a stored photo; null for a name we would never have generated. */
export function storedPhotoPath(uploadDir: string, name: string): string | null {
  if (!STORED_NAME.test(name)) return null;
  return path.join(path.resolve(photoDir(uploadDir)), name);
}
