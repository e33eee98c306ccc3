/**
 * Starts Kindloop for the browser tests: an up-to-date built client and a new temporary database seeded
 * with the demo drive, on a port of its own, so the tests never touch data/.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { buildIfChanged } from '../../scripts/build-if-changed';
import { E2E_PASSWORD } from './password';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-e2e-'));
// Builds only when the client's sources changed since the last build.
if (!process.env.E2E_SKIP_BUILD) buildIfChanged();

// NODE_ENV is left as `npm start` leaves it, so the browser tests run the configuration people get.
Object.assign(process.env, {
  PORT: process.env.E2E_PORT ?? '3310',
  HOST: '127.0.0.1',
  DATABASE_PATH: path.join(dir, 'e2e.sqlite'),
  UPLOAD_DIR: path.join(dir, 'uploads'),
  EXPORT_DIR: path.join(dir, 'exports'),
  MAIL_CATCHER_PORT: process.env.E2E_MAIL_PORT ?? '2626',
  DEMO_PASSWORD: E2E_PASSWORD,
  SCRYPT_LOG_N: '12',
  // Browser tests sign in many times from one address.
  LOGIN_MAX_FAILURES: '200',
  // The drop-off tests move the product clock past a booked slot (PUT /api/drive/clock/now).
  TEST_CLOCK: '1',
});

process.on('exit', () => fs.rmSync(dir, { recursive: true, force: true }));
for (const sig of ['SIGINT', 'SIGTERM'] as const) process.on(sig, () => process.exit(0));

await import('../../server/index');
