import type { Request, RequestHandler, Response } from 'express';
import { signedCookie } from 'cookie-parser';
import { KEPT_MAX_MS, sessionWriteGeneration, writeGeneration } from '../db/kept';
import { nowMs } from './clock';

/** A kept answer as `keptJson` sends it (server/lib/kept-json.ts). */
export interface DoorAnswer {
  body: Buffer;
  gzipped?: Buffer;
  etag: string;
}

interface Entry {
  /**
   * The write generation the answer was read under: while it holds, neither the data the answer
   * was read from nor the person the session names (users are data) has changed.
   */
  generation: number;
  /**
   * The session generation under which the session's row was last seen to be `sessionRow`. Every
   * write moves it on (server/db/kept.ts); when only sessions were written (another person's
   * renewal, say), the row is read again and compared.
   */
  sessionGeneration: number;
  sessionRow: string;
  /** Wall-clock instant (ms) from which the session's stamp is due again, or the answer is old. */
  staleAt: number;
  /** Product-clock span (ms) in which the answer holds: the drive's day it was read on, up to a slot's end. */
  from: number;
  until: number;
  /** Every header the answer went out with, security headers included, as they were set. */
  headers: Array<[string, number | string | string[]]>;
  answer: DoorAnswer;
  send: (req: Request, res: Response, answer: DoorAnswer) => void;
}

interface Arrival {
  door: KeptDoor;
  sid: string;
  key: string;
  generation: number;
  sessionGeneration: number;
}

const ARRIVAL = Symbol('kept door arrival');
type Arrived = Request & { [ARRIVAL]?: Arrival };

/** Past this many entries (or verified cookies) the door starts afresh: made-up cookies cannot fill the memory. */
const MAX_ENTRIES = 10_000;

/**
 * The first value of one cookie in a Cookie header, URI-decoded as express-session reads it.
 * Should this pick another of two cookies of the same name than express-session would, it still
 * only ever opens the session whose signature it checked, which the client holds anyway.
 */
export function cookieValue(header: string | undefined, name: string): string | undefined {
  if (!header) return undefined;
  let from = 0;
  while (from < header.length) {
    let end = header.indexOf(';', from);
    if (end === -1) end = header.length;
    const eq = header.indexOf('=', from);
    if (eq !== -1 && eq < end && header.slice(from, eq).trim() === name) {
      let value = header.slice(eq + 1, end).trim();
      if (value.length >= 2 && value.charCodeAt(0) === 34 && value.charCodeAt(value.length - 1) === 34) value = value.slice(1, -1);
      try {
        return value.includes('%') ? decodeURIComponent(value) : value;
      } catch {
        return undefined;
      }
    }
    from = end + 1;
  }
  return undefined;
}

/**
 * Kept answers handed out at the door (docs/decisions/0018-kept-answers-at-the-door.md).
 *
 * A signed-in read of a kept route (server/lib/kept-json.ts) that asks again for the same URL
 * with the same session, while no data has been written since and its session's row is still the
 * one it was, gets the same bytes and headers it got last time. Everything that decided that answer
 * still holds then: the session is the same (so is who signed in, and their role: users are data),
 * the data it was read from is the same, the drive's day has not turned, and the session's stamp
 * is not yet due for renewal. So the answer is sent from here, before the session, passport, the
 * router and validation run again. When only sessions were written meanwhile (someone else's
 * renewal or sign-out: on a busy drive one every few seconds), the session's row is read again
 * (one prepared statement) and compared with the one the answer was kept with.
 *
 * The session cookie's signature is checked as express-session checks it (a verified cookie is
 * remembered, so an HMAC is not made on every request). Whatever is not certain (another URL, a
 * write to data, a changed session row, a stamp due within the minute, an answer older than KEPT_MAX_MS, a request
 * that is not a GET) goes the whole way through as before.
 */
export class KeptDoor {
  private readonly entries = new Map<string, Entry>();
  private readonly verified = new Map<string, string>();
  /** Answers handed out at the door, for tests and benches. */
  served = 0;

  constructor(
    private readonly opts: {
      cookieName: string;
      secret: string;
      touchEveryMs: number;
      daySpan: () => { from: number; to: number };
      /** A session's stored row while it is kept under the current session generation. */
      keptSessionRow: (sid: string) => string | undefined;
      /** A session's stored row read from the database (undefined when there is none). */
      readSessionRow: (sid: string) => Promise<string | undefined>;
    },
  ) {}

  /** The session id a request's cookie names, if its signature is right. */
  private sessionId(req: Request): string | undefined {
    const raw = cookieValue(req.headers.cookie, this.opts.cookieName);
    if (raw === undefined || !raw.startsWith('s:')) return undefined;
    const known = this.verified.get(raw);
    if (known !== undefined) return known;
    const sid = signedCookie(raw, this.opts.secret);
    if (typeof sid !== 'string') return undefined;
    if (this.verified.size >= MAX_ENTRIES) this.verified.clear();
    this.verified.set(raw, sid);
    return sid;
  }

  /** Whether an entry still holds as far as nothing but the session's row is concerned. */
  private holds(entry: Entry): boolean {
    const at = nowMs();
    return entry.generation === writeGeneration() && Date.now() < entry.staleAt && at >= entry.from && at < entry.until;
  }

  private serve(req: Request, res: Response, entry: Entry): void {
    this.served += 1;
    for (const [name, value] of entry.headers) res.setHeader(name, value);
    entry.send(req, res, entry.answer);
  }

  readonly middleware: RequestHandler = (req, res, next) => {
    if (req.method !== 'GET' || !req.url.startsWith('/api/')) return next();
    const sid = this.sessionId(req);
    if (sid === undefined) return next();
    const key = `${sid}\n${req.url}`;
    const arrive = () => {
      (req as Arrived)[ARRIVAL] = { door: this, sid, key, generation: writeGeneration(), sessionGeneration: sessionWriteGeneration() };
      next();
    };
    const entry = this.entries.get(key);
    if (!entry) return arrive();
    if (!this.holds(entry)) {
      this.entries.delete(key);
      return arrive();
    }
    const sessionGeneration = sessionWriteGeneration();
    if (entry.sessionGeneration === sessionGeneration) return this.serve(req, res, entry);
    // Only sessions were written since: this one holds if its row is still the one it was.
    const kept = this.opts.keptSessionRow(sid);
    if (kept !== undefined) return this.confirm(req, res, entry, key, kept, sessionGeneration, arrive);
    this.opts.readSessionRow(sid).then((row) => this.confirm(req, res, entry, key, row, sessionGeneration, arrive), next);
  };

  private confirm(req: Request, res: Response, entry: Entry, key: string, row: string | undefined, sessionGeneration: number, arrive: () => void): void {
    if (row === entry.sessionRow && sessionWriteGeneration() === sessionGeneration && entry.generation === writeGeneration() && this.entries.get(key) === entry) {
      entry.sessionGeneration = sessionGeneration;
      return this.serve(req, res, entry);
    }
    if (this.entries.get(key) === entry) this.entries.delete(key);
    arrive();
  }

  /**
   * Keep `answer`, with the session's row, for the next request of this session to this URL, when
   * nothing has been written since the request arrived (a kept answer is handed out only under the
   * write generation it was read under, so it was read under the one the request arrived with).
   * Called by the route once its headers are set and before it sends; `until` is the product-clock
   * instant the answer stops holding, `send` how the route sends it (encoding and 304s decided per
   * request).
   */
  static keep(req: Request, res: Response, answer: DoorAnswer, until: number, send: Entry['send']): void {
    const arrival = (req as Arrived)[ARRIVAL];
    if (!arrival) return;
    const { door } = arrival;
    const lastSeen = (req.session as { lastSeen?: unknown } | undefined)?.lastSeen;
    if (
      typeof lastSeen !== 'number' ||
      !req.user ||
      req.sessionID !== arrival.sid ||
      writeGeneration() !== arrival.generation ||
      sessionWriteGeneration() !== arrival.sessionGeneration
    ) {
      return;
    }
    // The row this request's session was read from, kept by the store under this generation.
    const sessionRow = door.opts.keptSessionRow(arrival.sid);
    if (sessionRow === undefined) return;
    const day = door.opts.daySpan();
    if (door.entries.size >= MAX_ENTRIES) door.entries.clear();
    const headers: Entry['headers'] = [];
    for (const name of res.getHeaderNames()) headers.push([name, res.getHeader(name)!]);
    door.entries.set(arrival.key, {
      generation: arrival.generation,
      sessionGeneration: arrival.sessionGeneration,
      sessionRow,
      staleAt: Math.min(lastSeen + door.opts.touchEveryMs, Date.now() + KEPT_MAX_MS),
      from: day.from,
      until: Math.min(until, day.to),
      headers,
      answer,
      send,
    });
  }
}
