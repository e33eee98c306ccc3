import { expect } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { loadConfig, type Config } from '../../server/config/env';
import { openDatabase } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models/index';
import { migrate } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed/demo';
import '../../server/db/seed/all-steps';
import { createApp, type KindloopApp } from '../../server/app';

export const DEMO_PASSWORD = 'test-demo-password';

export interface TestApp {
  app: KindloopApp;
  sequelize: Sequelize;
  config: Config;
  dir: string;
  close: () => Promise<void>;
}

/** A fresh app on its own temporary SQLite file, migrated and (by default) seeded with the demo drive. */
export async function makeTestApp(opts: { seed?: boolean; env?: Record<string, string> } = {}): Promise<TestApp> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-test-'));
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_PATH: path.join(dir, 'test.sqlite'),
    UPLOAD_DIR: path.join(dir, 'uploads'),
    EXPORT_DIR: path.join(dir, 'exports'),
    // Cheap hashes keep the suite fast; production keeps OWASP's N=2^17.
    SCRYPT_LOG_N: '10',
    DEMO_PASSWORD,
    ...opts.env,
  });
  fs.mkdirSync(config.uploadDir, { recursive: true });
  fs.mkdirSync(config.exportDir, { recursive: true });
  const sequelize = await openDatabase(config.databasePath);
  initModels(sequelize);
  await migrate(sequelize);
  if (opts.seed !== false) await seedDemo(sequelize, DEMO_PASSWORD, config.scryptLogN);
  const app = createApp({ sequelize, config, sessionSecret: 'x'.repeat(40) });
  return {
    app,
    sequelize,
    config,
    dir,
    close: async () => {
      app.locals.close();
      await sequelize.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** A cookie-keeping client that fetches the CSRF token and sends it on every write. */
export class Client {
  agent: ReturnType<typeof request.agent>;
  token = '';
  constructor(app: KindloopApp) {
    this.agent = request.agent(app);
  }
  async refreshToken() {
    const res = await this.agent.get('/api/auth/csrf');
    this.token = res.body.csrfToken;
    return this.token;
  }
  async login(email: string, password = DEMO_PASSWORD) {
    await this.refreshToken();
    const res = await this.agent.post('/api/auth/login').set('X-CSRF-Token', this.token).send({ email, password });
    await this.refreshToken();
    return res;
  }
  get(url: string) {
    return this.agent.get(url);
  }
  post(url: string, body?: object) {
    return this.agent.post(url).set('X-CSRF-Token', this.token).send(body);
  }
  patch(url: string, body?: object) {
    return this.agent.patch(url).set('X-CSRF-Token', this.token).send(body);
  }
  put(url: string, body?: object) {
    return this.agent.put(url).set('X-CSRF-Token', this.token).send(body);
  }
  delete(url: string) {
    return this.agent.delete(url).set('X-CSRF-Token', this.token);
  }
}

export async function signedIn(app: KindloopApp, who: 'volunteer' | 'organiser' | 'coordinator' | string) {
  const c = new Client(app);
  const email = who.includes('@') ? who : `${who}@example.org`;
  const res = await c.login(email);
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return c;
}

/**
 * A drop-off desk open every day, 09:00–12:00 and 13:00–17:00 in half-hour slots for three visits, so
 * there are slots whatever day the suite runs; made by the coordinator through the API.
 */
export async function openEveryDayDesk(coordinator: Client, site: { name: string; address: string; closures?: Array<{ from: string; to: string; note: string }> }) {
  const every = [{ from: '09:00', to: '12:00' }, { from: '13:00', to: '17:00' }];
  const res = await coordinator.post('/api/sites', {
    name: site.name,
    address: site.address,
    lat: null,
    lng: null,
    openingHours: { mon: every, tue: every, wed: every, thu: every, fri: every, sat: every, sun: every },
    slotMinutes: 30,
    slotCapacity: 3,
    closures: site.closures ?? [],
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.site.id as number;
}
