import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { OptimisticLockError, UniqueConstraintError, ForeignKeyConstraintError, ValidationError, TimeoutError } from 'sequelize';
import { HttpError } from '../lib/http-error';

interface Issue {
  path: string;
  message: string;
}

function send(res: Parameters<ErrorRequestHandler>[2], status: number, message: string, issues: Issue[] = []) {
  res.status(status).json({ error: { message, issues } });
}

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, `No route for ${req.method} ${req.path}`));
};

/** The one error handler: client mistakes get a 4xx with the fields named; nothing else leaks a stack. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, next) => {
  if (res.headersSent) return next(err);
  if (err instanceof ZodError) {
    const issues = err.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
    const first = issues[0];
    return send(res, 400, first ? `${first.path ? `${first.path}: ` : ''}${first.message}` : 'Invalid request', issues);
  }
  if (err instanceof HttpError) return send(res, err.status, err.message, err.issues);
  if (err instanceof OptimisticLockError) {
    return send(res, 409, 'Someone else changed this record at the same time; reload and try again');
  }
  if (err instanceof UniqueConstraintError) {
    const fields = err.errors.map((e) => ({ path: e.path ?? '', message: `${e.path ?? 'value'} is already taken` }));
    return send(res, 409, fields[0]?.message ?? 'That already exists', fields);
  }
  if (err instanceof ForeignKeyConstraintError) return send(res, 409, 'This refers to a record that does not exist');
  if (err instanceof ValidationError) {
    return send(res, 400, err.errors[0]?.message ?? 'Invalid value', err.errors.map((e) => ({ path: e.path ?? '', message: e.message })));
  }
  // Writes queue in-process (server/db/sequelize.ts); a lock still held past every retry means another
  // process (a backup, a script) holds the database. Say so and ask for a retry rather than a bare 500.
  if (err instanceof TimeoutError) {
    res.setHeader('Retry-After', '2');
    return send(res, 503, 'Kindloop is busy saving other changes; please try again in a moment');
  }
  // body-parser and multer errors carry a status or a code of their own.
  const e = err as { type?: string; status?: number; code?: string; message?: string; field?: string };
  if (e.type === 'entity.parse.failed') return send(res, 400, 'The request body is not valid JSON');
  if (e.type === 'entity.too.large') return send(res, 413, 'The request is too large');
  if (e.code === 'LIMIT_FILE_SIZE') return send(res, 413, 'A file is larger than allowed', [{ path: e.field ?? 'file', message: 'File too large' }]);
  if (e.code && e.code.startsWith('LIMIT_')) return send(res, 400, e.message ?? 'Upload refused', [{ path: e.field ?? 'file', message: e.message ?? '' }]);
  if (typeof e.status === 'number' && e.status >= 400 && e.status < 500) return send(res, e.status, e.message ?? 'Bad request');
  console.error(err);
  send(res, 500, 'Something went wrong on our side; nothing you did. Please try again.');
};
