import sqlite3 from 'sqlite3';
import { noteWrite, writeKind } from './kept';

type Callback = (err: Error | null, rows: unknown[]) => void;

/**
 * Sequelize's SQLite dialect asks `PRAGMA table_info(...)` for the table of every SELECT it runs, to
 * know which columns to parse as dates and JSON (lib/dialects/sqlite/query.js, `run`). The answer
 * only changes when the schema does, so this Database remembers it per connection and forgets it
 * whenever a statement that can change a schema (CREATE, ALTER, DROP) goes through the connection.
 * It is handed to Sequelize as its `dialectModule`, the documented way to swap the driver.
 */
const TABLE_INFO = /^PRAGMA table_info\(`([^`]+)`\)$/;
const CHANGES_SCHEMA = /^\s*(CREATE|ALTER|DROP)\b/i;

class CachingDatabase extends sqlite3.Database {
  private columnInfo = new Map<string, unknown[]>();
  private statements = new Map<string, Promise<sqlite3.Statement>>();

  /**
   * Runs a read through a statement prepared once per connection and kept. The per-request lookups
   * (the session row, the signed-in user, the drive's zone) go through here: Sequelize's own path
   * costs about a millisecond of CPU per query in building the SQL, capturing a stack and making
   * instances. `all` steps the statement to its end, so it holds no read transaction between calls.
   */
  async cachedAll<T>(sql: string, params: unknown[]): Promise<T[]> {
    const statement = await this.cachedStatement(sql);
    return new Promise((resolve, reject) => statement.all(params, (err: Error | null, rows: T[]) => (err ? reject(err) : resolve(rows))));
  }

  /** The statement for `sql`, prepared on this connection once and kept until it closes. */
  cachedStatement(sql: string): Promise<sqlite3.Statement> {
    let ready = this.statements.get(sql);
    if (!ready) {
      const preparing = new Promise<sqlite3.Statement>((resolve, reject) => {
        const statement: sqlite3.Statement = this.prepare(sql, (err: Error | null) => (err ? reject(err) : resolve(statement)));
      });
      // A statement that could not be prepared (a table not there yet, say) is tried afresh next time.
      preparing.catch(() => {
        if (this.statements.get(sql) === preparing) this.statements.delete(sql);
      });
      this.statements.set(sql, preparing);
      ready = preparing;
    }
    return ready;
  }

  /** SQLite refuses to close a connection that still has prepared statements; finalise ours first. */
  override close(callback?: (err: Error | null) => void): void {
    const pending = [...this.statements.values()];
    this.statements.clear();
    if (pending.length === 0) return super.close(callback);
    void Promise.allSettled(pending).then(async (settled) => {
      for (const s of settled) if (s.status === 'fulfilled') await new Promise<void>((r) => s.value.finalize(() => r()));
      super.close(callback);
    });
  }

  private forgetIfSchemaChanges(sql: unknown) {
    if (typeof sql === 'string' && CHANGES_SCHEMA.test(sql)) this.columnInfo.clear();
  }

  /**
   * Answers kept until a write (server/db/kept.ts) are dropped before a statement that may change
   * data runs and again once it has finished (for a COMMIT, once its writes are visible to others).
   */
  private watchWrite(sql: unknown, rest: unknown[]): unknown[] {
    if (typeof sql !== 'string') return rest;
    const kind = writeKind(sql);
    if (kind === 'read') return rest;
    noteWrite(kind);
    const last = rest.length - 1;
    const callback = rest[last];
    if (typeof callback !== 'function') return rest;
    const after = function (this: unknown, ...args: unknown[]) {
      noteWrite(kind);
      return (callback as (...a: unknown[]) => unknown).apply(this, args);
    };
    return [...rest.slice(0, last), after];
  }

  override all(sql: string, ...rest: unknown[]): this {
    const match = TABLE_INFO.exec(sql);
    const callback = rest[rest.length - 1];
    if (match && rest.length === 1 && typeof callback === 'function') {
      const table = match[1]!;
      // For some includes (a through table) Sequelize names the table `undefined`; there is no such
      // table, so the answer is always empty and is not worth a statement on every request.
      if (table === 'undefined') {
        process.nextTick(() => (callback as Callback).call(this, null, []));
        return this;
      }
      const cached = this.columnInfo.get(table);
      if (cached) {
        process.nextTick(() => (callback as Callback).call(this, null, cached));
        return this;
      }
      return super.all(sql, (err: Error | null, rows: unknown[]) => {
        // An empty answer means the table is not there yet; ask again next time.
        if (!err && rows.length > 0) this.columnInfo.set(table, rows);
        (callback as Callback).call(this, err, rows);
      });
    }
    this.forgetIfSchemaChanges(sql);
    return (super.all as (...args: unknown[]) => this)(sql, ...this.watchWrite(sql, rest));
  }

  override run(sql: string, ...rest: unknown[]): this {
    this.forgetIfSchemaChanges(sql);
    return (super.run as (...args: unknown[]) => this)(sql, ...this.watchWrite(sql, rest));
  }

  override exec(sql: string, ...rest: unknown[]): this {
    this.forgetIfSchemaChanges(sql);
    return (super.exec as (...args: unknown[]) => this)(sql, ...this.watchWrite(sql, rest));
  }
}

/** The sqlite3 module with its Database swapped for the caching one. */
export const cachingSqlite3 = { ...sqlite3, Database: CachingDatabase } as unknown as typeof sqlite3;
