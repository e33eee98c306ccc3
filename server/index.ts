import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { loadConfig } from './config/env';
import { openDatabase } from './db/sequelize';
import { initModels } from './db/models/index';
import { migrate } from './db/migrate';
import { isEmpty, seedDemo } from './db/seed/demo';
import './db/seed/all-steps';
import { createApp } from './app';
import { catcherCredentials, startMailCatcher } from './mail/catcher';
import { createTransport } from './mail/transport';
import { startOutboxWorker } from './mail/worker';
import { startReminderScheduler } from './modules/bookings/reminders';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

/** SESSION_SECRET when given; otherwise one generated on first start and kept beside the database. */
function sessionSecret(given: string | undefined, databasePath: string): string {
  if (given) return given;
  const file = path.join(path.dirname(path.resolve(databasePath)), 'session-secret');
  if (fs.existsSync(file)) return fs.readFileSync(file, 'utf8').trim();
  const secret = randomBytes(48).toString('base64url');
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

async function main() {
  const config = loadConfig();
  for (const dir of [config.uploadDir, config.exportDir]) fs.mkdirSync(dir, { recursive: true });
  const sequelize = await openDatabase(config.databasePath);
  initModels(sequelize);
  await migrate(sequelize);
  if (config.seedDemo && (await isEmpty())) {
    await seedDemo(sequelize, config.demoPassword, config.scryptLogN, new Date(), { uploadDir: config.uploadDir });
    console.log('Seeded the demo drive (accounts: volunteer@, organiser@, coordinator@example.org)');
  }
  const credentials = catcherCredentials();
  if (!config.smtpUrl) {
    await startMailCatcher(config.mailCatcherPort, { sender: config.mailFrom, credentials });
    console.log(`Local mail catcher on 127.0.0.1:${config.mailCatcherPort} (read it on the Mail page as a coordinator)`);
  }
  startOutboxWorker(createTransport(config.smtpUrl, { port: config.mailCatcherPort, credentials }), config.mailFrom);
  startReminderScheduler({ sequelize, publicUrl: config.publicUrl });

  const app = createApp({
    sequelize,
    config,
    sessionSecret: sessionSecret(config.sessionSecret, config.databasePath),
    clientDir: config.serveClient ? path.join(root, 'dist') : undefined,
  });
  // Express 5 hands a listen failure (a port in use, say) to this callback.
  app.listen(config.port, config.host, (err?: Error) => {
    if (err) {
      console.error(`Kindloop could not listen on ${config.host}:${config.port}: ${err.message}`);
      process.exit(1);
    }
    console.log(`Kindloop is ready on http://${config.host}:${config.port}`);
  });
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
