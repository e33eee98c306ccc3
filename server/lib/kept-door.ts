import type { Request, RequestHandler, Response } from 'express';
import { signedCookie } from 'cookie-parser';
import { KEPT_MAX_MS, sessionWriteGeneration } from '../db/kept';
import { nowMs } from './clock';

/** A kept answer as `keptJson` sends it (server/lib/kept-json.ts). */
export interface DoorAnswer {
  body: Buffer;
  gzipped?: Buffer;
  etag: string;
}

interface Entry {
  /**
   * The session generation the request arrived under. Every write moves it on, to the sessions
   * table or any other (server/db/kept.ts), so while it holds neither the session row, nor the
   * person it names, nor the data the answer was read from has changed.
   */
  sessionGeneration: number;
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
 * with the same session, while nothing has been written to the database or to the sessions table
 * since, gets the same bytes and headers it got last time. Everything that decided that answer
 * still holds then: the session row is the one it was (so is who signed in, and their role: any
 * write to users moves the write generation), the data it was read from is the same, the drive's
 * day has not turned, and the session's stamp is not yet due for renewal. So the answer is sent
 * from here, before the session, passport, the router and validation run again.
 *
 * The session cookie's signature is checked as express-session checks it (a verified cookie is
 * remembered, so an HMAC is not made on every request). Whatever is not certain (another URL, a
 * changed generation, a stamp due within the minute, an answer older than KEPT_MAX_MS, a request
 * that is not a GET) goes the whole way through as before.
 */
export class KeptDoor {
  private readonly entries = new Map<string, Entry>();
  private readonly verified = new Map<string, string>();
  /** Answers handed out at the door, for tests and benches. */
  served = 0;

  constructor(private readonly opts: { cookieName: string; secret: string; touchEveryMs: number; daySpan: () => { from: number; to: number } }) {}

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

  private holdsAt(entry: Entry, at: number): boolean {
    return at >= entry.from && at < entry.until;
  }

  readonly middleware: RequestHandler = (req, res, next) => {
    if (req.method !== 'GET' || !req.url.startsWith('/api/')) return next();
    const sid = this.sessionId(req);
    if (sid === undefined) return next();
    const key = `${sid}\n${req.url}`;
    const sessionGeneration = sessionWriteGeneration();
    const entry = this.entries.get(key);
    if (entry) {
      if (entry.sessionGeneration === sessionGeneration && Date.now() < entry.staleAt && this.holdsAt(entry, nowMs())) {
        this.served += 1;
        for (const [name, value] of entry.headers) res.setHeader(name, value);
        return entry.send(req, res, entry.answer);
      }
      this.entries.delete(key);
    }
    (req as Arrived)[ARRIVAL] = { door: this, sid, key, sessionGeneration };
    next();
  };

  /**
   * Keep `answer` for the next request of this session to this URL, when nothing has been written
   * since the request arrived (a kept answer is handed out only under the write generation it was
   * read under, so it was read under the one the request arrived with). Called by the route once
   * its headers are set and before it sends; `until` is the product-clock instant the answer stops
   * holding, `send` how the route sends it (encoding and 304s decided per request).
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
      sessionWriteGeneration() !== arrival.sessionGeneration
    ) {
      return;
    }
    const day = door.opts.daySpan();
    if (door.entries.size >= MAX_ENTRIES) door.entries.clear();
    const headers: Entry['headers'] = [];
    for (const name of res.getHeaderNames()) headers.push([name, res.getHeader(name)!]);
    door.entries.set(arrival.key, {
      sessionGeneration: arrival.sessionGeneration,
      staleAt: Math.min(lastSeen + door.opts.touchEveryMs, Date.now() + KEPT_MAX_MS),
      from: day.from,
      until: Math.min(until, day.to),
      headers,
      answer,
      send,
    });
  }
}
