/**
 * CPU per request, beside bare Express answering the same bytes: the figure the load test's ratio
 * comes from, measured apart from the machine's other load (a busy machine slows both sides' wall
 * time, but not the CPU each request costs).
 *
 *   npx tsx bench/api-cpu.ts [--db bench/data/demo-20k.sqlite] [--requests 300] [--only needs]
 *
 * Starts Kindloop's bundled server (as `npm start` does) on a copy of the database and the bare
 * baseline, each in its own process; signs in as the demo volunteer and organiser; sends each route
 * its requests one after another over one kept-alive connection per server, the two servers taking
 * turns every few requests, and reads the CPU each server
 * process used from /proc/<pid>/stat. Prints milliseconds of CPU per request for both and the ratio.
 * With `--profile DIR` the Kindloop process writes a V8 CPU profile into DIR when it stops.
 */
import type { ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { buildServerIfChanged } from '../scripts/build-if-changed';
import { arg, benchRoutes, raw, root, startBare, startKindloop, stop, waitFor } from './api-harness';

const DB = path.resolve(root, arg('db', 'bench/data/demo-20k.sqlite'));
const REQUESTS = Number(arg('requests', '300'));
const ONLY = arg('only', '');
const PROFILE = arg('profile', '');
const PORT = 3421;
const MAIL_PORT = 3422;
const BARE_PORT = 3423;
const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
const bareAgent = new http.Agent({ keepAlive: true, maxSockets: 1 });

/** User plus system CPU of a process so far, in milliseconds (fields 14 and 15 of /proc/<pid>/stat). */
function cpuMs(pid: number): number {
  const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  const ticks = Number(fields[11]) + Number(fields[12]);
  return (ticks * 1000) / 100;
}

/** Requests of one side sent back to back before the other side takes its turn. */
const CHUNK = 25;

/**
 * CPU per request of Kindloop and of bare Express on one route, the two taking turns every
 * CHUNK requests, so that a change in the machine's load or clock during the run falls on both
 * alike (measured one after the other, the bare side's own figure moved by up to a factor of 3).
 */
async function cpuPerRequest(
  kindloop: { pid: number; port: number; url: string; headers: Record<string, string> },
  bare: { pid: number; port: number; url: string },
): Promise<{ k: number; b: number }> {
  const send = async (port: number, url: string, headers: Record<string, string>, n: number) => {
    for (let i = 0; i < n; i++) {
      const r = await raw(port, url, { headers, agent: port === kindloop.port ? agent : bareAgent });
      if (r.status !== 200) throw new Error(`${url} answered ${r.status}`);
    }
  };
  await send(kindloop.port, kindloop.url, kindloop.headers, 30);
  await send(bare.port, bare.url, {}, 30);
  let k = 0;
  let b = 0;
  for (let done = 0; done < REQUESTS; done += CHUNK) {
    const n = Math.min(CHUNK, REQUESTS - done);
    let before = cpuMs(kindloop.pid);
    await send(kindloop.port, kindloop.url, kindloop.headers, n);
    k += cpuMs(kindloop.pid) - before;
    before = cpuMs(bare.pid);
    await send(bare.port, bare.url, {}, n);
    b += cpuMs(bare.pid) - before;
  }
  return { k: k / REQUESTS, b: b / REQUESTS };
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
    server = startKindloop({ port: PORT, mailPort: MAIL_PORT, dbCopy, dir, nodeArgs });
    await waitFor(PORT, '/api/health', 60_000);
    const routes = await benchRoutes(PORT, ONLY, (volunteer) => [{ name: 'GET /api/auth/me (volunteer)', url: '/api/auth/me', cookie: volunteer }]);
    const bodies: Buffer[] = [];
    for (const r of routes) bodies.push((await raw(PORT, r.url, { headers: { cookie: r.cookie } })).body);
    bare = await startBare(BARE_PORT, dir, bodies);
    console.log(`${REQUESTS} sequential requests per route, one connection; load average ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}\n`);
    console.log('| route (role) | bytes | Kindloop CPU ms/req | bare CPU ms/req | ratio (bare ÷ Kindloop) |');
    console.log('|---|---|---|---|---|');
    for (const [i, r] of routes.entries()) {
      const { k, b } = await cpuPerRequest(
        { pid: server.pid!, port: PORT, url: r.url, headers: { cookie: r.cookie } },
        { pid: bare.pid!, port: BARE_PORT, url: `/r/${i}` },
      );
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
