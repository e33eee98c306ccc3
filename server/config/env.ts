import { z } from 'zod';

const bool = z
  .enum(['1', '0', 'true', 'false', 'yes', 'no', 'on', 'off'])
  .transform((v) => ['1', 'true', 'yes', 'on'].includes(v));

/**
 * Every setting has an embedded default that works on a fresh machine, so `npm start` needs no
 * configuration at all. Parsed once at start-up; a bad value stops the server with a clear message.
 */
export const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  HOST: z.string().min(1).default('127.0.0.1'),
  PUBLIC_URL: z.string().url().optional(),
  DATABASE_PATH: z.string().min(1).default('data/kindloop.sqlite'),
  UPLOAD_DIR: z.string().min(1).default('data/uploads'),
  EXPORT_DIR: z.string().min(1).default('exports'),
  SMTP_URL: z.string().url().optional(),
  MAIL_FROM: z.string().min(3).default('Kindloop <no-reply@kindloop.example.org>'),
  MAIL_CATCHER_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters').optional(),
  SESSION_IDLE_MINUTES: z.coerce.number().int().min(5).max(24 * 60).default(120),
  COOKIE_SECURE: bool.optional(),
  // The demo accounts follow the same 15-character minimum as everyone's (shared/schemas/user.ts).
  DEMO_PASSWORD: z.string().min(15).default('knit-one-purl-two'),
  SEED_DEMO: bool.default(true),
  /** log2 of scrypt's N. OWASP Password Storage Cheat Sheet: N=2^17, r=8, p=1. */
  SCRYPT_LOG_N: z.coerce.number().int().min(10).max(20).default(17),
  LOGIN_MAX_FAILURES: z.coerce.number().int().min(1).max(1000).default(8),
  SERVE_CLIENT: bool.default(true),
  /** A tile server for the maps, e.g. https://tiles.example.org/{z}/{x}/{y}.png; unset: the demo town's own basemap. */
  TILE_URL: z
    .string()
    .url()
    .refine((u) => ['{z}', '{x}', '{y}'].every((k) => u.includes(k)), 'TILE_URL must hold {z}, {x} and {y}')
    .optional(),
  /** The credit the tile server's terms ask for, shown on every map; required with TILE_URL. */
  TILE_ATTRIBUTION: z.string().min(1).optional(),
  /** Lets a coordinator set the product clock (PUT /api/drive/clock/now): for the browser tests, never in production. */
  TEST_CLOCK: bool.default(false),
});

export type Env = z.infer<typeof EnvSchema>;

export interface Config {
  env: Env['NODE_ENV'];
  port: number;
  host: string;
  publicUrl: string;
  databasePath: string;
  uploadDir: string;
  exportDir: string;
  smtpUrl?: string;
  mailFrom: string;
  mailCatcherPort: number;
  sessionSecret?: string;
  sessionIdleMinutes: number;
  cookieSecure: boolean;
  demoPassword: string;
  seedDemo: boolean;
  scryptLogN: number;
  loginMaxFailures: number;
  serveClient: boolean;
  tiles: { url: string; attribution: string } | null;
  testClock: boolean;
}

export function loadConfig(source: NodeJS.ProcessEnv = process.env): Config {
  const parsed = EnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Kindloop cannot start, a setting is wrong:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  if (e.TILE_URL && !e.TILE_ATTRIBUTION) {
    throw new Error('Kindloop cannot start, a setting is wrong:\n  TILE_ATTRIBUTION: a tile server needs the credit its terms ask for');
  }
  if (e.TEST_CLOCK && e.NODE_ENV === 'production') {
    throw new Error('Kindloop cannot start, a setting is wrong:\n  TEST_CLOCK: a settable clock is for tests, never in production');
  }
  return {
    env: e.NODE_ENV,
    port: e.PORT,
    host: e.HOST,
    publicUrl: (e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`).replace(/\/$/, ''),
    databasePath: e.DATABASE_PATH,
    uploadDir: e.UPLOAD_DIR,
    exportDir: e.EXPORT_DIR,
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    mailCatcherPort: e.MAIL_CATCHER_PORT,
    sessionSecret: e.SESSION_SECRET,
    sessionIdleMinutes: e.SESSION_IDLE_MINUTES,
    cookieSecure: e.COOKIE_SECURE ?? e.NODE_ENV === 'production',
    demoPassword: e.DEMO_PASSWORD,
    seedDemo: e.SEED_DEMO,
    scryptLogN: e.SCRYPT_LOG_N,
    loginMaxFailures: e.LOGIN_MAX_FAILURES,
    serveClient: e.SERVE_CLIENT,
    tiles: e.TILE_URL && e.TILE_ATTRIBUTION ? { url: e.TILE_URL, attribution: e.TILE_ATTRIBUTION } : null,
    testClock: e.TEST_CLOCK,
  };
}
