import type { Sequelize } from 'sequelize';
import { preparedRead } from './prepared-read';

/**
 * Answers kept until the database is written. Every statement that can change data, on any
 * connection the driver opens (server/db/sqlite-column-cache.ts), moves the write generation on
 * before it runs and again once it has finished, and so does every COMMIT: a kept answer is handed
 * out only while the generation it was read under still holds. A reader takes the generation
 * before its first statement, so an answer read while a transaction was still open (and so without
 * its writes) is dropped when that transaction commits, even if the commit lands while the reader
 * is still working. Commits from outside the process are seen through SQLite's data_version
 * (`watchOtherWriters`) within a quarter of a second.
 *
 * Writes to the sessions table alone move only the session generation: signed-in reads renew their
 * session's row once a minute, and no kept answer but the session rows themselves reads sessions.
 * Every other write moves both.
 */

let generation = 0;
let sessionGeneration = 0;

export const writeGeneration = (): number => generation;
export const sessionWriteGeneration = (): number => sessionGeneration;

/** Called by the driver around every statement that may change data. */
export function noteWrite(kind: 'data' | 'sessions' = 'data'): void {
  sessionGeneration += 1;
  if (kind === 'data') generation += 1;
}

const READ = /^\s*(SELECT\b|PRAGMA\s+table_info\b|PRAGMA\s+data_version\b|BEGIN\b|ROLLBACK\b|SAVEPOINT\b|RELEASE\b|EXPLAIN\b)/i;
const READING_WITH = /^\s*WITH\b/i;
const WRITES_IN_IT = /\b(INSERT|UPDATE|DELETE|REPLACE)\b/i;
const SESSIONS_ONLY = /^\s*(UPDATE|INSERT(\s+OR\s+\w+)?\s+INTO|DELETE\s+FROM)\s+`?sessions`?\s/i;

/** What a statement may change (conservative: anything not known to be a read counts as data). */
export function writeKind(sql: string): 'read' | 'sessions' | 'data' {
  if (READ.test(sql)) return 'read';
  if (READING_WITH.test(sql) && !WRITES_IN_IT.test(sql)) return 'read';
  if (SESSIONS_ONLY.test(sql)) return 'sessions';
  return 'data';
}

/** Whether a statement may change what a kept answer read. */
export const mayWrite = (sql: string): boolean => writeKind(sql) === 'data';

/** Kept answers are read again at least this often, whatever the generations say (behind the kept one: see keptUntilWrite). */
export const KEPT_MAX_MS = 10_000;

interface Entry {
  generation: number;
  at: number;
  /** The answer stops holding at this instant of the product clock (a slot ending, say). */
  until: number;
  size: number;
  value: unknown;
}

interface Store {
  /** The write generation the kept entries were read under; older ones are all stale. */
  generation: number;
  /** Bytes of the kept answers that said their size (serialised bodies). */
  bytes: number;
  entries: Map<string, Entry>;
  running: Map<string, { generation: number; promise: Promise<unknown> }>;
  /** Whether an old answer is being read again behind the kept one (one at a time, see keptUntilWrite). */
  refreshing: boolean;
}
/** One store per database (tests open several in one process). */
const stores = new WeakMap<object, Store>();
const MAX_ENTRIES = 2_000;
/** Kept bodies together stay under this; past it the store starts afresh. */
const MAX_BYTES = 32 * 2 ** 20;

function storeOf(database: object): Store {
  let s = stores.get(database);
  if (!s) stores.set(database, (s = { generation: -1, bytes: 0, entries: new Map(), running: new Map(), refreshing: false }));
  return s;
}

export interface KeepOptions {
  /** The latest product-clock instant (ms) at which the answer still holds; Infinity by default. */
  until?: (value: never) => number;
  /** The product clock's now, for `until`. */
  now?: () => number;
  /** The answer's size in bytes, counted against the store's limit. */
  size?: (value: never) => number;
}

/**
 * The kept answer for `key`, or `compute()`'s, kept until the next write. Requests that arrive while
 * the same answer is being read, with nothing written since, share that read (under load they come
 * fifty at a time). The key must name everything the answer depends on besides the data: the
 * reader, the query, the day. `database` is the Sequelize instance the answer is read from.
 *
 * An answer older than KEPT_MAX_MS with nothing written since is still the truth (the generations
 * say so, other processes' commits included): it is handed out while one fresh read runs behind it,
 * so the waiting requests do not all stall on that read every few seconds under load. Such reads
 * run one at a time per database.
 */
export async function keptUntilWrite<T>(database: object, key: string, compute: () => Promise<T>, opts: KeepOptions = {}): Promise<T> {
  const store = storeOf(database);
  const gen = generation;
  const wallNow = Date.now();
  const hit = store.entries.get(key);
  if (hit && hit.generation === gen && (hit.until === Infinity || (opts.now?.() ?? wallNow) < hit.until)) {
    if (wallNow - hit.at >= KEPT_MAX_MS && !store.running.has(key) && !store.refreshing) {
      // One at a time: answers kept together grow old together (fifty makers' own lists, say), and
      // reading them all again at once stalled every request behind them. The others are still
      // the truth meanwhile, and take their turn on a later request.
      store.refreshing = true;
      readAndKeep(store, key, compute, opts, gen)
        .catch(() => undefined)
        .finally(() => (store.refreshing = false));
    }
    return hit.value as T;
  }
  const shared = store.running.get(key);
  if (shared && shared.generation === gen) return shared.promise as Promise<T>;
  return readAndKeep(store, key, compute, opts, gen);
}

async function readAndKeep<T>(store: Store, key: string, compute: () => Promise<T>, opts: KeepOptions, gen: number): Promise<T> {
  const { entries, running } = store;
  const promise = compute();
  running.set(key, { generation: gen, promise });
  try {
    const value = await promise;
    // A write that landed while this was read makes it stale: hand it out once, don't keep it.
    if (generation === gen) {
      const size = opts.size ? (opts.size as (v: T) => number)(value) : 0;
      if (store.generation !== gen || entries.size >= MAX_ENTRIES || store.bytes + size > MAX_BYTES) {
        store.generation = gen;
        entries.clear();
        store.bytes = 0;
      }
      const until = opts.until ? (opts.until as (v: T) => number)(value) : Infinity;
      store.bytes += size - (entries.get(key)?.size ?? 0);
      entries.set(key, { generation: gen, at: Date.now(), until, size, value });
    }
    return value;
  } finally {
    if (running.get(key)?.promise === promise) running.delete(key);
  }
}

/** How often the file is asked whether another process has committed to it. */
export const OTHER_WRITERS_EVERY_MS = 250;

/**
 * Commits by another process (a script run against the live file) never pass this process's driver.
 * SQLite's `PRAGMA data_version` changes on a connection whenever another connection has committed,
 * so asking it on the connection used outside transactions, a few times a second, moves the
 * generations on for those too (and, harmlessly, once more for this process's own transactions).
 * Stops when the database is closed.
 */
export function watchOtherWriters(sequelize: Sequelize): void {
  let last: number | undefined;
  let asking = false;
  const timer = setInterval(() => {
    if (asking) return;
    asking = true;
    preparedRead<{ data_version: number }>(sequelize, 'PRAGMA data_version', [])
      .then(([row]) => {
        const version = row?.data_version;
        if (last !== undefined && version !== last) noteWrite('data');
        last = version;
      })
      .catch(() => clearInterval(timer))
      .finally(() => {
        asking = false;
      });
  }, OTHER_WRITERS_EVERY_MS);
  timer.unref();
  const close = sequelize.close.bind(sequelize);
  sequelize.close = () => {
    clearInterval(timer);
    return close();
  };
}
