/**
 * The API under load, beside bare Express answering the same bytes in the same run.
 *
 *   npm run bench:api -- [--db bench/data/demo-20k.sqlite] [--duration 10] [--connections 50] [--no-write]
 *
 * Grows the demo to 20,000 blankets first when the database is missing (bench/grow-demo.ts), starts
 * Kindloop as `npm start` does (the bundled server, rebundled first if its sources changed) on a
 * copy of it (port 3411) and the bare baseline (port 3413), signs in as the demo
 * volunteer and organiser, and runs autocannon against each route and then its baseline. Prints
 * req/s, p50, p99 and bytes with the ratio to the baseline, the server's start time and its largest
 * RSS during the run, and writes them into bench/README.md between the api-bench markers.
 */
import type { ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { growDemo } from './grow-demo';
import { buildServerIfChanged } from '../scripts/build-if-changed';
import sqlite3 from 'sqlite3';
import { arg, benchRoutes, raw, root, signIn, startBare, startKindloop, stop, waitFor } from './api-harness';

const DB = path.resolve(root, arg('db', 'bench/data/demo-20k.sqlite'));
const DURATION = Number(arg('duration', '10'));
const CONNECTIONS = Number(arg('connections', '50'));
/** Only the routes whose URL contains this (for a look at one; the README table wants them all). */
const ONLY = arg('only', '');
const PORT = 3411;
const MAIL_PORT = 3412;
const BARE_PORT = 3413;

function rssOf(pid: number): number {
  try {
    const m = /VmRSS:\s+(\d+) kB/.exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? Number(m[1]) * 1024 : 0;
  } catch {
    return 0;
  }
}

/** Makers signed in for the row in which every request comes from one of many sessions. */
const MAKERS = 50;

async function load(url: string, headers: Record<string, string>, cookies?: string[], duration = DURATION) {
  let n = 0;
  // With several sessions, each request takes the next one's cookie in turn.
  const requests = cookies ? [{ setupRequest: (req: { headers?: Record<string, string> }) => ({ ...req, headers: { ...req.headers, cookie: cookies[n++ % cookies.length]! } }) }] : undefined;
  const r = await autocannon({ url, connections: CONNECTIONS, duration, headers, ...(requests ? { requests } : {}) } as autocannon.Options);
  const codes = Object.entries((r as { statusCodeStats?: Record<string, { count: number }> }).statusCodeStats ?? {})
    .filter(([code]) => /^\d+$/.test(code) && !code.startsWith('2'))
    .map(([code, s]) => `${s.count} × ${code}`);
  const kinds = [...codes, r.errors ? `${r.errors} errors` : '', r.timeouts ? `${r.timeouts} timeouts` : ''].filter(Boolean).join(', ');
  return { rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, errors: r.errors + r.timeouts + r.non2xx, kinds };
}

async function main() {
  if (!fs.existsSync(DB)) {
    console.log(`No ${path.relative(root, DB)} yet: growing the demo drive first…`);
    await growDemo({ db: DB, blankets: 20_000, makers: 2_000 });
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-bench-'));
  const dbCopy = path.join(dir, 'bench.sqlite');
  fs.copyFileSync(DB, dbCopy);

  let server: ChildProcess | undefined;
  let bare: ChildProcess | undefined;
  const cleanUp = () => {
    stop(server);
    stop(bare);
    fs.rmSync(dir, { recursive: true, force: true });
  };
  process.on('SIGINT', () => {
    cleanUp();
    process.exit(130);
  });
  try {
    buildServerIfChanged();
    const started = Date.now();
    server = startKindloop({ port: PORT, mailPort: MAIL_PORT, dbCopy, dir });
    await waitFor(PORT, '/api/health', 60_000);
    const startSeconds = (Date.now() - started) / 1000;
    let maxRss = rssOf(server.pid!);
    const sampler = setInterval(() => (maxRss = Math.max(maxRss, rssOf(server!.pid!))), 200);

    const routes = await benchRoutes(PORT, ONLY);
    const bodies: Buffer[] = [];
    const gzipBytes: number[] = [];
    for (const r of routes) {
      const plain = await raw(PORT, r.url, { headers: { cookie: r.cookie } });
      if (plain.status !== 200) throw new Error(`${r.name} answered ${plain.status}: ${plain.body.toString().slice(0, 200)}`);
      bodies.push(plain.body);
      gzipBytes.push((await raw(PORT, r.url, { headers: { cookie: r.cookie, 'accept-encoding': 'gzip' } })).body.length);
    }
    bare = await startBare(BARE_PORT, dir, bodies);

    // Both servers answer each route for two seconds first, unmeasured, so the first route in the
    // table does not carry the JIT's warm-up for the rest.
    for (const [i, r] of routes.entries()) {
      await autocannon({ url: `http://127.0.0.1:${PORT}${r.url}`, connections: CONNECTIONS, duration: 2, headers: { cookie: r.cookie } });
      await autocannon({ url: `http://127.0.0.1:${BARE_PORT}/r/${i}`, connections: CONNECTIONS, duration: 2 });
    }
    const rows: string[] = [];
    console.log(`\n${CONNECTIONS} connections, ${DURATION} s per route after a 2 s unmeasured warm-up of each; Kindloop first, then bare Express with the same bytes\n`);
    const measure = async (name: string, url: string, cookie: string, i: number, cookies?: string[]) => {
      if (cookies) await load(`http://127.0.0.1:${PORT}${url}`, { cookie }, cookies, 2);
      const k = await load(`http://127.0.0.1:${PORT}${url}`, { cookie }, cookies);
      const b = await load(`http://127.0.0.1:${BARE_PORT}/r/${i}`, {});
      const row = `| ${name} | ${k.rps.toFixed(0)} | ${k.p50} | ${k.p99} | ${bodies[i]!.length.toLocaleString('en')} | ${gzipBytes[i]!.toLocaleString('en')} | ${b.rps.toFixed(0)} | ${b.p99} | ${(k.rps / b.rps).toFixed(2)}× |${k.errors ? ` ${k.kinds}` : ''}`;
      rows.push(row);
      console.log(row);
    };
    for (const [i, r] of routes.entries()) await measure(r.name, r.url, r.cookie, i);

    // Two harder cases for the volunteer's needs, beside the same baseline: fifty makers each with
    // their own session (each one's first read goes the whole way), and the demo volunteer while
    // something is written to the database every second (each write drops every kept answer).
    const needs = routes.findIndex((r) => r.url === '/api/needs');
    /** A signed-in session's cookie, with the CSRF token its sign-out will need. */
    const signOutLater = async (email: string) => {
      const cookie = await signIn(PORT, email);
      const csrf = await raw(PORT, '/api/auth/csrf', { headers: { cookie } });
      return { cookie, token: (JSON.parse(csrf.body.toString()) as { csrfToken: string }).csrfToken };
    };
    const signOut = async ({ cookie, token }: { cookie: string; token: string }) => {
      const r = await raw(PORT, '/api/auth/logout', { method: 'POST', headers: { cookie, 'x-csrf-token': token } });
      if (r.status >= 300) throw new Error(`sign-out answered ${r.status}`);
    };
    if (needs !== -1) {
      const cookies: string[] = [];
      for (let m = 1; m <= MAKERS; m++) cookies.push(await signIn(PORT, `maker-${String(m).padStart(4, '0')}@example.org`));
      await measure(`GET /api/needs (${MAKERS} makers, a session each)`, '/api/needs', cookies[0]!, needs, cookies);
      // The same, while other people's sessions end five times a second (a sign-out writes only
      // the sessions table, as the renewals of a busy drive's many sessions do).
      const leaving: Array<{ cookie: string; token: string }> = [];
      for (let m = MAKERS + 1; m <= MAKERS + 5 * (DURATION + 3); m++) leaving.push(await signOutLater(`maker-${String(m).padStart(4, '0')}@example.org`));
      const signOuts = setInterval(() => {
        const next = leaving.shift();
        if (next) void signOut(next);
      }, 200);
      try {
        await measure(`GET /api/needs (${MAKERS} makers, a session each; another session ends every 200 ms)`, '/api/needs', cookies[0]!, needs, cookies);
      } finally {
        clearInterval(signOuts);
      }
      const db = new sqlite3.Database(dbCopy);
      const writer = setInterval(() => db.run('UPDATE needs SET quantity = quantity WHERE id = (SELECT MIN(id) FROM needs)'), 1000);
      try {
        await measure('GET /api/needs (volunteer, a write every second)', '/api/needs', routes[needs]!.cookie, needs);
      } finally {
        clearInterval(writer);
        await new Promise<void>((resolve) => db.close(() => resolve()));
      }
    }
    clearInterval(sampler);
    maxRss = Math.max(maxRss, rssOf(server.pid!));

    const cpu = os.cpus();
    const machine = `${cpu[0]?.model ?? 'unknown CPU'} (${cpu.length} cores, shared), ${(os.totalmem() / 2 ** 30).toFixed(1)} GiB RAM, ${os.type()} ${os.release()}, Node ${process.version}`;
    const report = [
      '<!-- api-bench:start -->',
      `Run on ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC by \`npm run bench:api\`; machine: ${machine}.`,
      `Database: ${path.relative(root, DB)} (the demo grown by bench/grow-demo.ts). ${CONNECTIONS} connections, ${DURATION} s per route after a 2 s warm-up of each; autocannon sends no Accept-Encoding, so both sides send the plain bytes.`,
      '',
      `Server start to first answer: ${startSeconds.toFixed(1)} s. Largest RSS during the run: ${(maxRss / 2 ** 20).toFixed(0)} MB.`,
      '',
      '| route (role) | Kindloop req/s | p50 ms | p99 ms | bytes | gzip bytes | bare Express req/s | bare p99 ms | ratio |',
      '|---|---|---|---|---|---|---|---|---|',
      ...rows,
      '<!-- api-bench:end -->',
    ].join('\n');
    console.log(`\nstart ${startSeconds.toFixed(1)} s, largest RSS ${(maxRss / 2 ** 20).toFixed(0)} MB`);
    if (!process.argv.includes('--no-write')) {
      const readme = path.join(root, 'bench', 'README.md');
      const text = fs.existsSync(readme) ? fs.readFileSync(readme, 'utf8') : '';
      const next = /<!-- api-bench:start -->[\s\S]*<!-- api-bench:end -->/.test(text)
        ? text.replace(/<!-- api-bench:start -->[\s\S]*<!-- api-bench:end -->/, report)
        : `${text}\n${report}\n`;
      fs.writeFileSync(readme, next);
      console.log('Wrote the figures into bench/README.md');
    }
  } finally {
    cleanUp();
  }
}

await main();
