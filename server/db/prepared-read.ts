import type { Sequelize } from 'sequelize';

type Rows = (err: Error | null, rows: unknown[]) => void;
type Connection = {
  cachedAll?: <T>(sql: string, params: unknown[]) => Promise<T[]>;
  cachedStatement?: (sql: string) => Promise<{ all(params: unknown[], cb: Rows): void }>;
  all(sql: string, params: unknown[], cb: Rows): void;
};

const connectionOf = (sequelize: Sequelize) =>
  (sequelize.connectionManager as unknown as { getConnection(options: object): Promise<Connection> }).getConnection({});

/**
 * Reads rows with a statement prepared once on the connection Sequelize uses outside transactions
 * (see CachingDatabase.cachedAll). For the few reads every signed-in request makes; everything else
 * goes through the models. It sees what any read outside a transaction sees: committed rows.
 */
export async function preparedRead<T>(sequelize: Sequelize, sql: string, params: unknown[]): Promise<T[]> {
  const connection = await connectionOf(sequelize);
  if (connection.cachedAll) return connection.cachedAll<T>(sql, params);
  return new Promise((resolve, reject) => connection.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
}

/**
 * One statement read many times (a manifest's pages): the connection and the prepared statement are
 * looked up once, and each call then hands its read to SQLite before it returns. A read asked for
 * through preparedRead reaches SQLite only after a few promise steps, and a caller that goes on with
 * a long stretch of work in the meantime (writing a page of CSV) kept SQLite waiting for all of it.
 */
export async function preparedReader<T>(sequelize: Sequelize, sql: string): Promise<(params: unknown[]) => Promise<T[]>> {
  const connection = await connectionOf(sequelize);
  const run = connection.cachedStatement
    ? await connection.cachedStatement(sql).then((statement) => (params: unknown[], cb: Rows) => statement.all(params, cb))
    : (params: unknown[], cb: Rows) => connection.all(sql, params, cb);
  return (params) => new Promise((resolve, reject) => run(params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
}
