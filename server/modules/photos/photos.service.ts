import type { Sequelize } from 'sequelize';
import { Blanket } from '../../db/models/blanket';
import { BlanketEvent } from '../../db/models/blanket-event';
import { Photo } from '../../db/models/photo';
import { HttpError, notFound } from '../../lib/http-error';
import { MAX_PHOTOS_PER_BLANKET } from '@shared/schemas/blanket-log';
import type { Actor } from '../../auth/actor';
import { visibleBlanket } from '../blankets/blankets.service';
import { preparePhoto, removeFiles, storedPhotoPath, writePhoto, type IncomingFile, type PreparedPhoto, type StoredNames } from './photo-files';

const eventData = (v: unknown) => v as BlanketEvent['data'];

const photoError = (status: number, message: string) => new HttpError(status, `photos: ${message}`, [{ path: 'photos', message }]);

/**
 * More files in one request than any blanket takes is the request's own fault (400); a blanket that
 * has no room left for them is a conflict with what is already there, often an upload that won (409).
 */
function roomLeft(existing: number, adding: number) {
  if (existing + adding > MAX_PHOTOS_PER_BLANKET) {
    const left = MAX_PHOTOS_PER_BLANKET - existing;
    throw photoError(
      adding > MAX_PHOTOS_PER_BLANKET ? 400 : 409,
      `a blanket has at most ${MAX_PHOTOS_PER_BLANKET} photos; this one has ${existing}, so ${left === 0 ? 'remove one first' : `add at most ${left} more`}`,
    );
  }
}

/** The blanket its maker is adding photos to; checked before the upload is read at all. */
export async function blanketForUpload(actor: Actor, id: number): Promise<Blanket> {
  const b = await visibleBlanket(actor, id);
  if (b.userId !== actor.id) throw new HttpError(403, 'Only its maker adds photos to a blanket');
  roomLeft(await Photo.count({ where: { blanketId: b.id } }), 1);
  return b;
}

/**
 * Checks every file first, then writes them and records the rows in one transaction. If anything
 * fails, every file this request wrote is removed again, so a refused upload leaves nothing behind.
 */
export async function addPhotos(
  sequelize: Sequelize,
  actor: Actor,
  blanket: Blanket,
  files: IncomingFile[] | undefined,
  uploadDir: string,
): Promise<Photo[]> {
  if (!files || files.length === 0) {
    throw photoError(400, "choose at least one photo (send it as multipart/form-data in the field 'photos')");
  }
  const prepared: PreparedPhoto[] = [];
  for (const [i, f] of files.entries()) prepared.push(await preparePhoto(f, i));

  const written: string[] = [];
  try {
    const stored: StoredNames[] = [];
    for (const p of prepared) stored.push(await writePhoto(uploadDir, p, written));
    return await sequelize.transaction(async (transaction) => {
      // Counted again inside the transaction: two uploads at once must not make a fifth photo.
      roomLeft(await Photo.count({ where: { blanketId: blanket.id }, transaction }), prepared.length);
      const rows: Photo[] = [];
      for (const [i, p] of prepared.entries()) {
        rows.push(
          await Photo.create(
            {
              blanketId: blanket.id,
              fileName: stored[i]!.fileName,
              thumbName: stored[i]!.thumbName,
              mime: p.mime,
              bytes: p.full.length,
              width: p.width,
              height: p.height,
            },
            { transaction },
          ),
        );
      }
      await BlanketEvent.create(
        {
          blanketId: blanket.id,
          actorId: actor.id,
          kind: 'photos-added',
          fromStatus: null,
          toStatus: null,
          reason: null,
          data: eventData({ photoIds: rows.map((r) => r.id) }),
        },
        { transaction },
      );
      return rows;
    });
  } catch (err) {
    await removeFiles(written);
    throw err;
  }
}

/** A photo of a blanket this person may see, and the file to send for the size asked. */
export async function photoFile(actor: Actor, blanketId: number, photoId: number, size: 'full' | 'thumb', uploadDir: string) {
  await visibleBlanket(actor, blanketId);
  const photo = await Photo.findOne({ where: { id: photoId, blanketId } });
  if (!photo) throw notFound('That photo');
  const file = storedPhotoPath(uploadDir, size === 'thumb' ? photo.thumbName : photo.fileName);
  if (!file) throw notFound('That photo');
  return { file, mime: size === 'thumb' ? 'image/webp' : photo.mime };
}

export async function removePhoto(sequelize: Sequelize, actor: Actor, blanketId: number, photoId: number, uploadDir: string) {
  const blanket = await visibleBlanket(actor, blanketId);
  if (blanket.userId !== actor.id) throw new HttpError(403, 'Only its maker removes photos from a blanket');
  const photo = await Photo.findOne({ where: { id: photoId, blanketId } });
  if (!photo) throw notFound('That photo');
  const names = [photo.fileName, photo.thumbName];
  await sequelize.transaction(async (transaction) => {
    await photo.destroy({ transaction });
    await BlanketEvent.create(
      { blanketId, actorId: actor.id, kind: 'photo-removed', fromStatus: null, toStatus: null, reason: null, data: eventData({ photoId }) },
      { transaction },
    );
  });
  // Files go only once the row is gone, so a failed delete never leaves a row pointing at nothing.
  await removeFiles(names.map((n) => storedPhotoPath(uploadDir, n)).filter((p): p is string => p !== null));
}
