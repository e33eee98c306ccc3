import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import type { Request, RequestHandler, Response } from 'express';
import { Drive } from '../db/models/drive';
import { keptUntilWrite } from '../db/kept';
import { driveToday } from '../modules/bookings/drive-clock';
import { nowMs } from './clock';
import { KeptDoor, type DoorAnswer } from './kept-door';

export interface KeptJsonOptions<T> {
  /**
   * Whom the answer is the same for besides the data: `user` keeps one per signed-in person (their
   * own figures are in it), `role` one per role (the same for every volunteer, say).
   */
  per: 'user' | 'role';
  /** The product-clock instant (ms) after which the answer no longer holds (a booked slot ending). */
  until?: (answer: T) => number;
}

/** The body, its gzip (made on the first request that accepts it) and ETag, and when it stops holding. */
interface Kept extends DoorAnswer {
  until: number;
}

/** What the compression middleware leaves alone as not worth compressing (its default threshold). */
const GZIP_FROM_BYTES = 1024;

const OWN_ENCODING = new WeakSet<RequestHandler>();

/** Whether a handler gzips its own answers, so the route needs no compression middleware. */
export function sendsOwnEncoding(handler: RequestHandler): boolean {
  return OWN_ENCODING.has(handler);
}

/**
 * A read route's answer, kept serialised until anything is written to the database
 * (server/db/kept.ts), per reader (see `per`), URL and drive day. The body and its ETag are made
 * once; a client that sends the ETag back gets a 304. The answer is the handler's own, byte for
 * byte what `res.json` would send; a refusal (a 404, say) is thrown as before and never kept.
 */
export function keptJson<T>(opts: KeptJsonOptions<T>, answer: (req: Request) => Promise<T>): RequestHandler {
  const handler: RequestHandler = async (req, res) => {
    const who = opts.per === 'user' ? `user ${req.user!.id}` : `role ${req.user!.role}`;
    const key = `json ${req.originalUrl} ${who} ${await driveToday()}`;
    const kept = await keptUntilWrite<Kept>(
      Drive.sequelize!,
      key,
      async () => {
        const value = await answer(req);
        const body = Buffer.from(JSON.stringify(value));
        // The weak ETag Express would have made for these bytes, made once.
        const etag = `W/"${body.length.toString(16)}-${createHash('sha1').update(body).digest('base64').slice(0, 27)}"`;
        return { body, etag, until: opts.until ? opts.until(value) : Infinity };
      },
      { until: (k: Kept) => k.until, now: nowMs, size: (k: Kept) => k.body.length },
    );
    res.setHeader('ETag', kept.etag);
    res.type('application/json');
    if (kept.body.length >= GZIP_FROM_BYTES) res.vary('Accept-Encoding');
    // The same session asking again for this URL, with nothing written meanwhile, is answered
    // before the session and the router run (server/lib/kept-door.ts).
    KeptDoor.keep(req, res, kept, kept.until, sendKept);
    sendKept(req, res, kept);
  };
  OWN_ENCODING.add(handler);
  return handler;
}

/**
 * A kept answer's bytes, gzipped once per kept answer rather than on every request (the compression
 * middleware leaves a response that already names its encoding alone). Express answers 304 itself
 * when the request's If-None-Match matches the ETag already set.
 */
function sendKept(req: Request, res: Response, kept: DoorAnswer): void {
  if (kept.body.length >= GZIP_FROM_BYTES && req.acceptsEncodings('gzip', 'identity') === 'gzip') {
    kept.gzipped ??= gzipSync(kept.body);
    res.setHeader('Content-Encoding', 'gzip');
    res.send(kept.gzipped);
    return;
  }
  res.send(kept.body);
}
