import { Sequelize } from 'sequelize';
import fs from 'node:fs';
import path from 'node:path';
import { cachingSqlite3 } from './sqlite-column-cache';

/** Opens the SQLite file with WAL and foreign keys on (SQLite leaves foreign keys off by default). */
export async function openDatabase(databasePath: string): Promise<Sequelize> {
  if (databasePath !== ':memory:') fs.mkdirSync(path.dirname(path.resolve(databasePath)), { recursive: true });
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    storage: databasePath,
    // Remembers each table's columns instead of asking SQLite again before every SELECT.
    dialectModule: cachingSqlite3,
    logging: false,
    // One connection: SQLite serialises writers anyway, and a single handle keeps PRAGMAs in force.
    pool: { max: 1, min: 1, idle: 60_000 },
    retry: { max: 5, match: [/SQLITE_BUSY/] },
  });
  await sequelize.query('PRAGMA journal_mode = WAL;');
  // Survives a process crash, costs a tenth of FULL per commit (docs/decisions/0005-synchronous-normal.md).
  await sequelize.query('PRAGMA synchronous = NORMAL;');
  await sequelize.query('PRAGMA foreign_keys = ON;');
  await sequelize.query('PRAGMA busy_timeout = 5000;');
  return sequelize;
}
