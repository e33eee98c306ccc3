/**
 * What the two API benches share (bench/api.ts under load, bench/api-cpu.ts CPU per request): a
 * plain HTTP client, signing in, Kindloop's bundled server started as `npm start` starts it on a
 * copy of the grown database, the routes measured, and the bare Express baseline answering the same
 * bytes.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { BENCH_PASSWORD } from './grow-demo';
import { SERVER_ENTRY } from '../scripts/build-if-changed';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

/** The value after `--name` on the command line, or the fallback. */
export const arg = (name: string, fallback: string) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && process.argv[i + 1] ? process.argv[i + 1]! : fallback;
};

export interface Raw {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: Buffer;
}

export function raw(port: number, url: string, opts: { method?: string; headers?: Record<string, string>; body?: string; agent?: http.Agent } = {}): Promise<Raw> {
  return new Promise((resolve, reject) => {
    const req = http.request({ host: '127.0.0.1', port, path: url, method: opts.method ?? 'GET', headers: opts.headers, agent: opts.agent }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    });
    req.on('error', reject);
    if (opts.body) req.write(opts.body);
    req.end();
  });
}

export async function waitFor(port: number, url: string, ms: number) {
  const until = Date.now() + ms;
  for (;;) {
    try {
      if ((await raw(port, url)).status === 200) return;
    } catch {
      /* not listening yet */
    }
    if (Date.now() > until) throw new Error(`Nothing answered on :${port}${url} within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

const cookieOf = (r: Raw) => (r.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ');

/** Signs a grown demo account in; the session cookie to send with its requests. */
export async function signIn(port: number, email: string): Promise<string> {
  const csrf = await raw(port, '/api/auth/csrf');
  const cookie = cookieOf(csrf);
  const token = (JSON.parse(csrf.body.toString()) as { csrfToken: string }).csrfToken;
  const login = await raw(port, '/api/auth/login', {
    method: 'POST',
    headers: { cookie, 'x-csrf-token': token, 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: BENCH_PASSWORD }),
  });
  if (login.status !== 200) throw new Error(`Sign-in as ${email} failed: ${login.status} ${login.body.toString()}`);
  return cookieOf(login);
}

export function stop(child: ChildProcess | undefined) {
  if (child?.pid && child.exitCode === null) child.kill('SIGTERM');
}

/**
 * Kindloop's bundled server on `dbCopy`, with its uploads, exports and mail catcher under `dir`
 * (run `buildServerIfChanged` first). Wait for it with `waitFor(port, '/api/health', ...)`.
 */
export function startKindloop(opts: { port: number; mailPort: number; dbCopy: string; dir: string; nodeArgs?: string[] }): ChildProcess {
  return spawn(process.execPath, [...(opts.nodeArgs ?? []), SERVER_ENTRY], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(opts.port),
      HOST: '127.0.0.1',
      DATABASE_PATH: opts.dbCopy,
      UPLOAD_DIR: path.join(opts.dir, 'uploads'),
      EXPORT_DIR: path.join(opts.dir, 'exports'),
      MAIL_CATCHER_PORT: String(opts.mailPort),
      SEED_DEMO: 'false',
      // Plain HTTP on loopback: a Secure cookie would never be set.
      COOKIE_SECURE: 'false',
      SERVE_CLIENT: 'false',
      SCRYPT_LOG_N: '12',
      LOGIN_MAX_FAILURES: '1000',
    },
  });
}

export interface BenchRoute {
  name: string;
  url: string;
  cookie: string;
}

/**
 * The routes of issue 8's table, signed in as the demo volunteer and organiser, kept to those whose
 * URL holds `only` when it is given. The intake queue is the first site's, today.
 */
export async function benchRoutes(port: number, only: string, extra: (volunteer: string) => BenchRoute[] = () => []): Promise<BenchRoute[]> {
  const volunteer = await signIn(port, 'volunteer@example.org');
  const organiser = await signIn(port, 'organiser@example.org');
  const sites = JSON.parse((await raw(port, '/api/sites', { headers: { cookie: organiser } })).body.toString()) as { sites: Array<{ id: number }> };
  const today = new Date();
  const day = `${today.getFullYear()}-${String(today.getMonth() + 1).padStart(2, '0')}-${String(today.getDate()).padStart(2, '0')}`;
  return [
    ...extra(volunteer),
    { name: 'GET /api/blankets (volunteer)', url: '/api/blankets', cookie: volunteer },
    { name: 'GET /api/needs (volunteer)', url: '/api/needs', cookie: volunteer },
    { name: 'GET /api/recipients (volunteer)', url: '/api/recipients', cookie: volunteer },
    { name: 'GET /api/intake/queue (organiser)', url: `/api/intake/queue?siteId=${sites.sites[0]!.id}&date=${day}`, cookie: organiser },
    { name: 'GET /api/blankets (organiser, page 1)', url: '/api/blankets', cookie: organiser },
    { name: 'GET /api/pledges (organiser, page 1)', url: '/api/pledges', cookie: organiser },
    { name: 'GET /api/drive/progress (organiser)', url: '/api/drive/progress', cookie: organiser },
  ].filter((r) => !only || r.url.includes(only));
}

/** Bare Express answering `bodies[i]` at /r/i (bench/bare-server.ts), once it is listening. */
export async function startBare(port: number, dir: string, bodies: Buffer[]): Promise<ChildProcess> {
  const bodiesFile = path.join(dir, 'bodies.json');
  fs.writeFileSync(bodiesFile, JSON.stringify(bodies.map((b) => b.toString('base64'))));
  const bare = spawn(process.execPath, ['--import', 'tsx', 'bench/bare-server.ts'], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: { ...process.env, NODE_ENV: 'production', BARE_PORT: String(port), BARE_BODIES: bodiesFile },
  });
  await waitFor(port, '/r/0', 30_000);
  return bare;
}
