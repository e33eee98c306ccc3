import type { Sequelize } from 'sequelize';

type Connection = {
  cachedAll?: <T>(sql: string, params: unknown[]) => Promise<T[]>;
  all(sql: string, params: unknown[], cb: (err: Error | null, rows: unknown[]) => void): void;
};

/**
 * Reads rows with a statement prepared once on the connection Sequelize uses outside transactions
 * (see CachingDatabase.cachedAll). For the few reads every signed-in request makes; everything else
 * goes through the models. It sees what any read outside a transaction sees: committed rows.
 */
export async function preparedRead<T>(sequelize: Sequelize, sql: string, params: unknown[]): Promise<T[]> {
  const manager = sequelize.connectionManager as unknown as { getConnection(options: object): Promise<Connection> };
  const connection = await manager.getConnection({});
  if (connection.cachedAll) return connection.cachedAll<T>(sql, params);
  return new Promise((resolve, reject) => connection.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
}
