import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import { loadConfig } from '../server/config/env';
import { openDatabase } from '../server/db/sequelize';
import { initModels } from '../server/db/models/index';
import { createApp } from '../server/app';

export async function makeRouteList() {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-routes-'));
  const config = loadConfig({ DATABASE_PATH: path.join(dir, 'r.sqlite') });
  const sequelize = await openDatabase(config.databasePath);
  initModels(sequelize);
  const app = createApp({ sequelize, config, sessionSecret: 'r'.repeat(40) });
  const rows = app.locals.routes.map((r) => ({
    method: r.method.toUpperCase(),
    path: r.path,
    who: r.access === 'public' ? 'anyone' : r.access === 'signed-in' ? 'signed in' : r.access.join(', '),
    summary: r.summary,
  }));
  app.locals.close();
  await sequelize.close();
  fs.rmSync(dir, { recursive: true, force: true });
  return rows;
}
