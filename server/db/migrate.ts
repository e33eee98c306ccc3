import { QueryTypes, type Sequelize } from 'sequelize';
import * as m0001 from './migrations/0001-foundation';
import * as m0002 from './migrations/0002-drive-data';
import * as m0003 from './migrations/0003-measured-size';
import * as m0010 from './migrations/0010-read-indexes';
import * as m0020 from './migrations/0020-mail-retry-window';
import * as m0050 from './migrations/0050-assignments';
import * as m0060 from './migrations/0060-mail-attachments';
import * as m0061 from './migrations/0061-drop-off-bookings';
import * as m0070 from './migrations/0070-delivery-runs';
import * as m0090 from './migrations/0090-thank-you-mail';
import * as m0091 from './migrations/0091-glance-indexes';
import * as m0100 from './migrations/0100-missed-drop-offs';
import * as m0130 from './migrations/0130-latest-check-index';

/**
 * Migrations are listed here in order rather than globbed, so the same list works under tsx, in
 * tests and in a bundle. Append new ones at the end; never edit one that has shipped.
 */
const migrations = [
  { name: '0001-foundation', ...m0001 },
  { name: '0002-drive-data', ...m0002 },
  { name: '0003-measured-size', ...m0003 },
  { name: '0010-read-indexes', ...m0010 },
  { name: '0020-mail-retry-window', ...m0020 },
  { name: '0050-assignments', ...m0050 },
  { name: '0060-mail-attachments', ...m0060 },
  { name: '0061-drop-off-bookings', ...m0061 },
  { name: '0070-delivery-runs', ...m0070 },
  { name: '0090-thank-you-mail', ...m0090 },
  { name: '0091-glance-indexes', ...m0091 },
  { name: '0100-missed-drop-offs', ...m0100 },
  { name: '0130-latest-check-index', ...m0130 },
];

const TABLE = 'schema_migrations';

/** umzug is loaded only when it has work to do: importing it costs a few hundred ms of every start. */
export async function createMigrator(sequelize: Sequelize) {
  const { Umzug, SequelizeStorage } = await import('umzug');
  return new Umzug({
    migrations: migrations.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: TABLE }),
    logger: undefined,
  });
}

/** True when the database has recorded every migration in the list (umzug's own table, read plainly). */
async function allApplied(sequelize: Sequelize): Promise<boolean> {
  const table = await sequelize.query<{ name: string }>(`SELECT name FROM sqlite_master WHERE type = 'table' AND name = ?`, {
    replacements: [TABLE],
    type: QueryTypes.SELECT,
  });
  if (table.length === 0) return false;
  const rows = await sequelize.query<{ name: string }>(`SELECT name FROM ${TABLE}`, { type: QueryTypes.SELECT });
  const done = new Set(rows.map((r) => r.name));
  return migrations.every((m) => done.has(m.name));
}

export async function migrate(sequelize: Sequelize) {
  if (await allApplied(sequelize)) return;
  await (await createMigrator(sequelize)).up();
}
