import { Sequelize, Transaction, TimeoutError } from 'sequelize';
import { AsyncLocalStorage } from 'node:async_hooks';
import fs from 'node:fs';
import path from 'node:path';
import { cachingSqlite3 } from './sqlite-column-cache';
import { watchOtherWriters } from './kept';

/**
 * How long a statement waits for another connection's write lock before SQLite answers SQLITE_BUSY.
 * Set on every connection, because Sequelize's SQLite dialect opens a fresh one per transaction and
 * node-sqlite3 gives each new connection a 1 s default (docs/decisions/0006-synchronous-normal.md).
 */
export const BUSY_TIMEOUT_MS = 5000;

/** Whole-transaction retries when a write lock still cannot be had (another process, a backup). */
const BUSY_RETRIES = 4;

type RawConnection = {
  configure(option: 'busyTimeout', ms: number): void;
  exec(sql: string, cb: (err: Error | null) => void): void;
};

/** Pragmas that are per connection in SQLite and so must be set on each one the dialect opens. */
function preparePerConnection(sequelize: Sequelize) {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options?: unknown): Promise<RawConnection>;
  };
  const original = manager.getConnection.bind(manager);
  const prepared = new WeakSet<RawConnection>();
  manager.getConnection = async (options?: unknown) => {
    const connection = await original(options);
    if (!prepared.has(connection)) {
      prepared.add(connection);
      connection.configure('busyTimeout', BUSY_TIMEOUT_MS);
      // WAL + NORMAL survives a crash of the process (docs/decisions/0006-synchronous-normal.md).
      await new Promise<void>((resolve, reject) =>
        connection.exec('PRAGMA foreign_keys = ON; PRAGMA synchronous = NORMAL;', (err) => (err ? reject(err) : resolve())),
      );
    }
    return connection;
  };
}

/** A promise chain that lets one write transaction run at a time, in arrival order. */
class WriteQueue {
  private tail: Promise<unknown> = Promise.resolve();
  private readonly holder = new AsyncLocalStorage<true>();
  waiting = 0;

  run<T>(work: () => Promise<T>): Promise<T> {
    // A transaction opened inside another one's callback already holds the queue.
    if (this.holder.getStore()) return work();
    this.waiting += 1;
    const result = this.tail.then(() => this.holder.run(true, work));
    this.tail = result.then(
      () => undefined,
      () => undefined,
    );
    return result.finally(() => {
      this.waiting -= 1;
    });
  }
}

const isBusy = (e: unknown) =>
  e instanceof TimeoutError || (e as { parent?: { code?: string } })?.parent?.code === 'SQLITE_BUSY' || (e as { code?: string })?.code === 'SQLITE_BUSY';

/**
 * Every managed transaction (`sequelize.transaction(async (t) => ...)`) goes through one in-process
 * queue and starts with BEGIN IMMEDIATE, so a transaction that reads and then writes never finds its
 * lock upgrade refused by a writer that committed in between. Races then resolve in the services'
 * own checks (409 for the losers) instead of SQLITE_BUSY surfacing as a 500.
 */
function serialiseWrites(sequelize: Sequelize) {
  const queue = new WriteQueue();
  const original = sequelize.transaction.bind(sequelize) as (...args: unknown[]) => Promise<unknown>;
  const patched = (optionsOrWork?: unknown, maybeWork?: unknown): Promise<unknown> => {
    const work = typeof optionsOrWork === 'function' ? optionsOrWork : maybeWork;
    const options = typeof optionsOrWork === 'function' ? {} : ((optionsOrWork as object | undefined) ?? {});
    // Unmanaged transactions (no callback) are left to their caller; the code base uses none.
    if (typeof work !== 'function') return original(optionsOrWork);
    return queue.run(async () => {
      for (let attempt = 0; ; attempt++) {
        try {
          return await original({ type: Transaction.TYPES.IMMEDIATE, ...options }, work);
        } catch (e) {
          if (!isBusy(e) || attempt >= BUSY_RETRIES) throw e;
          await new Promise((r) => setTimeout(r, 20 * 2 ** attempt));
        }
      }
    });
  };
  (sequelize as unknown as { transaction: typeof patched }).transaction = patched;
  (sequelize as unknown as { writeQueue: WriteQueue }).writeQueue = queue;
}

/** Opens the SQLite file with WAL and foreign keys on (SQLite leaves foreign keys off by default). */
export async function openDatabase(databasePath: string): Promise<Sequelize> {
  if (databasePath !== ':memory:') fs.mkdirSync(path.dirname(path.resolve(databasePath)), { recursive: true });
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    storage: databasePath,
    // Remembers each table's columns instead of asking SQLite again before every SELECT.
    dialectModule: cachingSqlite3,
    logging: false,
    pool: { max: 1, min: 1, idle: 60_000 },
    transactionType: Transaction.TYPES.IMMEDIATE,
    // Autocommit statements outside a transaction (the session store's) may still meet a writer.
    retry: { max: 5, match: [/SQLITE_BUSY/] },
  });
  preparePerConnection(sequelize);
  serialiseWrites(sequelize);
  await sequelize.query('PRAGMA journal_mode = WAL;');
  watchOtherWriters(sequelize);
  return sequelize;
}
