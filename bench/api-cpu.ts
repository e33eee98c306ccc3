/**
 * CPU per request, beside bare Express answering the same bytes: the figure the load test's ratio
 * comes from, measured apart from the machine's other load (a busy machine slows both sides' wall
 * time, but not the CPU each request costs).
 *
 *   npx tsx bench/api-cpu.ts [--db bench/data/demo-20k.sqlite] [--requests 300] [--only needs]
 *
 * Starts Kindloop's bundled server (as `npm start` does) on a copy of the database and the bare
 * baseline, each in its own process; signs in as the demo volunteer and organiser; sends each route
 * its requests one after another over one kept-alive connection and reads the CPU each server
 * process used from /proc/<pid>/stat. Prints milliseconds of CPU per request for both and the ratio.
 * With `--profile DIR` the Kindloop process writes a V8 CPU profile into DIR when it stops.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { BENCH_PASSWORD } from './grow-demo';
import { SERVER_ENTRY, buildServerIfChanged } from '../scripts/build-if-changed';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const arg = (name: string, fallback: string) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && process.argv[i + 1] ? process.argv[i + 1]! : fallback;
};
const DB = path.resolve(root, arg('db', 'bench/data/demo-20k.sqlite'));
const REQUESTS = Number(arg('requests', '300'));
const ONLY = arg('only', '');
const PROFILE = arg('profile', '');
const PORT = 3421;
const MAIL_PORT = 3422;
const BARE_PORT = 3423;
const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });

interface Raw {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: Buffer;
}

function raw(port: number, url: string, opts: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<Raw> {
  return new Promise((resolve, reject) => {
    const req = http.request({ host: '127.0.0.1', port, path: url, method: opts.method ?? 'GET', headers: opts.headers, agent }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    });
    req.on('error', reject);
    if (opts.body) req.write(opts.body);
    req.end();
  });
}

async function waitFor(port: number, url: string, ms: number) {
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

async function signIn(email: string): Promise<string> {
  const csrf = await raw(PORT, '/api/auth/csrf');
  const cookie = cookieOf(csrf);
  const token = (JSON.parse(csrf.body.toString()) as { csrfToken: string }).csrfToken;
  const login = await raw(PORT, '/api/auth/login', {
    method: 'POST',
    headers: { cookie, 'x-csrf-token': token, 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: BENCH_PASSWORD }),
  });
  if (login.status !== 200) throw new Error(`Sign-in as ${email} failed: ${login.status} ${login.body.toString()}`);
  return cookieOf(login);
}

/** User plus system CPU of a process so far, in milliseconds (fields 14 and 15 of /proc/<pid>/stat). */
function cpuMs(pid: number): number {
  const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  const ticks = Number(fields[11]) + Number(fields[12]);
  return (ticks * 1000) / 100;
}

async function cpuPerRequest(pid: number, port: number, url: string, headers: Record<string, string>): Promise<number> {
  for (let i = 0; i < 30; i++) await raw(port, url, { headers });
  const before = cpuMs(pid);
  for (let i = 0; i < REQUESTS; i++) {
    const r = await raw(port, url, { headers });
    if (r.status !== 200) throw new Error(`${url} answered ${r.status}`);
  }
  return (cpuMs(pid) - before) / REQUESTS;
}

function stop(child: ChildProcess | undefined) {
  if (child?.pid && child.exitCode === null) child.kill('SIGTERM');
}

async function main() {
  if (!fs.existsSync(DB)) throw new Error(`No ${path.relative(root, DB)}: run npm run bench:grow first`);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-cpu-'));
  const dbCopy = path.join(dir, 'bench.sqlite');
  fs.copyFileSync(DB, dbCopy);
  let server: ChildProcess | undefined;
  let bare: ChildProcess | undefined;
  try {
    buildServerIfChanged();
    // Node writes the profile only on a normal exit, so SIGTERM is turned into one.
    const nodeArgs = PROFILE
      ? ['--cpu-prof', `--cpu-prof-dir=${path.resolve(PROFILE)}`, '--import', "data:text/javascript,process.on('SIGTERM',()=>process.exit(0))"]
      : [];
    server = spawn(process.execPath, [...nodeArgs, SERVER_ENTRY], {
      cwd: root,
      stdio: ['ignore', 'ignore', 'inherit'],
      env: {
        ...process.env,
        NODE_ENV: 'production',
        PORT: String(PORT),
        HOST: '127.0.0.1',
        DATABASE_PATH: dbCopy,
        UPLOAD_DIR: path.join(dir, 'uploads'),
        EXPORT_DIR: path.join(dir, 'exports'),
        MAIL_CATCHER_PORT: String(MAIL_PORT),
        SEED_DEMO: 'false',
        COOKIE_SECURE: 'false',
        SERVE_CLIENT: 'false',
        SCRYPT_LOG_N: '12',
        LOGIN_MAX_FAILURES: '1000',
      },
    });
    await waitFor(PORT, '/api/health', 60_000);
    const volunteer = await signIn('volunteer@example.org');
    const organiser = await signIn('organiser@example.org');
    const sites = JSON.parse((await raw(PORT, '/api/sites', { headers: { cookie: organiser } })).body.toString()) as { sites: Array<{ id: number }> };
    const today = new Date();
    const day = `${today.getFullYear()}-${String(today.getMonth() + 1).padStart(2, '0')}-${String(today.getDate()).padStart(2, '0')}`;
    const routes = [
      { name: 'GET /api/auth/me (volunteer)', url: '/api/auth/me', cookie: volunteer },
      { name: 'GET /api/blankets (volunteer)', url: '/api/blankets', cookie: volunteer },
      { name: 'GET /api/needs (volunteer)', url: '/api/needs', cookie: volunteer },
      { name: 'GET /api/recipients (volunteer)', url: '/api/recipients', cookie: volunteer },
      { name: 'GET /api/intake/queue (organiser)', url: `/api/intake/queue?siteId=${sites.sites[0]!.id}&date=${day}`, cookie: organiser },
      { name: 'GET /api/blankets (organiser, page 1)', url: '/api/blankets', cookie: organiser },
      { name: 'GET /api/pledges (organiser, page 1)', url: '/api/pledges', cookie: organiser },
      { name: 'GET /api/drive/progress (organiser)', url: '/api/drive/progress', cookie: organiser },
    ].filter((r) => !ONLY || r.url.includes(ONLY));
    const bodies: Buffer[] = [];
    for (const r of routes) bodies.push((await raw(PORT, r.url, { headers: { cookie: r.cookie } })).body);
    const bodiesFile = path.join(dir, 'bodies.json');
    fs.writeFileSync(bodiesFile, JSON.stringify(bodies.map((b) => b.toString('base64'))));
    bare = spawn(process.execPath, ['--import', 'tsx', 'bench/bare-server.ts'], {
      cwd: root,
      stdio: ['ignore', 'ignore', 'inherit'],
      env: { ...process.env, NODE_ENV: 'production', BARE_PORT: String(BARE_PORT), BARE_BODIES: bodiesFile },
    });
    await waitFor(BARE_PORT, '/r/0', 30_000);
    console.log(`${REQUESTS} sequential requests per route, one connection; load average ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}\n`);
    console.log('| route (role) | bytes | Kindloop CPU ms/req | bare CPU ms/req | ratio (bare ÷ Kindloop) |');
    console.log('|---|---|---|---|---|');
    for (const [i, r] of routes.entries()) {
      const k = await cpuPerRequest(server.pid!, PORT, r.url, { cookie: r.cookie });
      const b = await cpuPerRequest(bare.pid!, BARE_PORT, `/r/${i}`, {});
      console.log(`| ${r.name} | ${bodies[i]!.length.toLocaleString('en')} | ${k.toFixed(2)} | ${b.toFixed(2)} | ${(b / k).toFixed(2)}× |`);
    }
    console.log(`\nload average afterwards ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}`);
  } finally {
    stop(server);
    stop(bare);
    // Give a profiling server the moment it needs to write its profile before the copy goes.
    await new Promise((r) => setTimeout(r, PROFILE ? 2000 : 100));
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

await main();
