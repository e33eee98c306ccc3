import multer from 'multer';
import rateLimit from 'express-rate-limit';
import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type { Config } from '../../config/env';
import { validate } from '../../middleware/validate';
import { HttpError } from '../../lib/http-error';
import { IdParamSchema } from '@shared/schemas/user';
import { MAX_PHOTO_BYTES, MAX_PHOTOS_PER_BLANKET, PhotoParamsSchema, PhotoQuerySchema } from '@shared/schemas/blanket-log';
import type { RouteDef } from '../route-table';
import { photoView } from '../blankets/blankets.service';
import { addPhotos, blanketForUpload, photoFile, removePhoto } from './photos.service';
import type { Blanket } from '../../db/models/blanket';

const FIELD = 'photos';

/**
 * Reads the upload into memory within fixed limits, so nothing touches the disk until every file
 * has been checked. Multer's own error codes become messages that name the field.
 */
function receivePhotos(): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    // Keep the client's path so a name like "../../x.jpg" can be refused instead of silently trimmed.
    preservePath: true,
    limits: { fileSize: MAX_PHOTO_BYTES, files: MAX_PHOTOS_PER_BLANKET, fields: 5, parts: MAX_PHOTOS_PER_BLANKET + 5 },
  }).array(FIELD, MAX_PHOTOS_PER_BLANKET);
  const mb = MAX_PHOTO_BYTES / (1024 * 1024);
  return (req, res, next) =>
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (!(err instanceof multer.MulterError)) return next(err);
      const fail = (status: number, path: string, message: string) => next(new HttpError(status, `${path}: ${message}`, [{ path, message }]));
      switch (err.code) {
        case 'LIMIT_FILE_SIZE':
          return fail(413, FIELD, `each photo may be at most ${mb} MB`);
        case 'LIMIT_FILE_COUNT':
          return fail(400, FIELD, `send at most ${MAX_PHOTOS_PER_BLANKET} photos`);
        case 'LIMIT_UNEXPECTED_FILE':
          return err.field === FIELD
            ? fail(400, FIELD, `send at most ${MAX_PHOTOS_PER_BLANKET} photos`)
            : fail(400, err.field ?? FIELD, `photos go in the field '${FIELD}'`);
        default:
          return fail(400, err.field ?? FIELD, err.message);
      }
    });
}

/** Upload requests one person may make in a quarter of an hour: a blanket takes at most four photos. */
export const UPLOADS_PER_PERSON = 40;

export function photoRoutes(sequelize: Sequelize, config: Config): RouteDef[] {
  // Every upload costs a decode, so one person (or one stolen session) cannot keep the server busy
  // with them; counted per account, before the body is read, so a refused request costs nothing.
  const perPerson = rateLimit({
    windowMs: 15 * 60_000,
    limit: UPLOADS_PER_PERSON,
    keyGenerator: (req) => `photos:${req.user!.id}`,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    message: { error: { message: 'That is a lot of photos in a short time; wait a few minutes and try again', issues: [{ path: 'photos', message: 'Too many uploads' }] } },
  });
  return [
    {
      method: 'post', path: '/api/blankets/:id/photos', access: 'signed-in', summary: 'Add photos to your blanket (multipart, field photos)',
      handlers: [
        perPerson,
        validate({ params: IdParamSchema }),
        async (req, res, next) => {
          res.locals.blanket = await blanketForUpload(req.user!, Number(req.params.id));
          next();
        },
        receivePhotos(),
        async (req, res) => {
          const rows = await addPhotos(sequelize, req.user!, res.locals.blanket as Blanket, req.files as Express.Multer.File[] | undefined, config.uploadDir);
          res.status(201).json({ photos: rows.map(photoView) });
        },
      ],
    },
    {
      method: 'get', path: '/api/blankets/:id/photos/:photoId', access: 'signed-in', summary: 'A blanket photo (?size=thumb for the thumbnail)',
      handlers: [
        validate({ params: PhotoParamsSchema, query: PhotoQuerySchema }),
        async (req, res) => {
          const size = (req.query as unknown as { size: 'full' | 'thumb' }).size;
          const { file, mime } = await photoFile(req.user!, Number(req.params.id), Number(req.params.photoId), size, config.uploadDir);
          res.set({
            'Content-Type': mime,
            'X-Content-Type-Options': 'nosniff',
            'Cache-Control': 'private, max-age=3600',
            'Content-Disposition': 'inline',
          });
          await new Promise<void>((resolve, reject) =>
            res.sendFile(file, { dotfiles: 'deny', headers: { 'Content-Type': mime } }, (err) => (err ? reject(err) : resolve())),
          );
        },
      ],
    },
    {
      method: 'delete', path: '/api/blankets/:id/photos/:photoId', access: 'signed-in', summary: 'Remove a photo from your blanket',
      handlers: [
        validate({ params: PhotoParamsSchema }),
        async (req, res) => {
          await removePhoto(sequelize, req.user!, Number(req.params.id), Number(req.params.photoId), config.uploadDir);
          res.status(204).end();
        },
      ],
    },
  ];
}
