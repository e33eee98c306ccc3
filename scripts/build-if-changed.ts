/**
 * `npm start` runs this before the server: it builds the client and bundles the server only when
 * what each build reads has changed since its last build. A hash of those files (paths and
 * contents) is kept beside each build (dist/.build-stamp, dist-server/.build-stamp); a checkout or
 * an edit that changes nothing a build reads costs no build.
 *
 * The server is bundled into dist-server/index.mjs (our code in one file, packages left to Node),
 * so starting it is plain `node` with nothing compiled or resolved through a loader on the way:
 * on the 20,000-blanket drive that halved the time to the first answer (bench/README.md).
 *
 *   tsx scripts/build-if-changed.ts [--force] [--client-only | --server-only]
 */
import { createHash } from 'node:crypto';
import { execSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildSync } from 'esbuild';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
/** Everything `vite build` reads: the client, the shared code, the page, the config, the locked packages. */
const CLIENT_INPUTS = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'tsconfig.json', 'package-lock.json'];
/** Everything the server bundle reads: the server, the shared code, the path aliases, the locked packages. */
const SERVER_INPUTS = ['server', 'shared', 'tsconfig.json', 'package-lock.json', 'scripts/build-if-changed.ts'];
export const SERVER_DIR = path.join(root, 'dist-server');
export const SERVER_ENTRY = path.join(SERVER_DIR, 'index.mjs');

function* files(p: string): Generator<string> {
  if (!fs.existsSync(p)) return;
  const st = fs.statSync(p);
  if (st.isFile()) {
    yield p;
    return;
  }
  for (const name of fs.readdirSync(p).sort()) yield* files(path.join(p, name));
}

function stampOf(inputs: string[]): string {
  const h = createHash('sha256');
  for (const input of inputs) {
    for (const f of files(path.join(root, input))) {
      h.update(path.relative(root, f));
      h.update('\0');
      h.update(fs.readFileSync(f));
      h.update('\0');
    }
  }
  return h.digest('hex');
}

export const sourceStamp = () => stampOf(CLIENT_INPUTS);

function upToDate(output: string, stampFile: string, stamp: string): boolean {
  return fs.existsSync(output) && fs.existsSync(stampFile) && fs.readFileSync(stampFile, 'utf8').trim() === stamp;
}

export function buildIfChanged(force = false): boolean {
  const stamp = sourceStamp();
  const stampFile = path.join(root, 'dist', '.build-stamp');
  if (!force && upToDate(path.join(root, 'dist', 'index.html'), stampFile, stamp)) return false;
  execSync('npx vite build --logLevel warn', { stdio: 'inherit', cwd: root });
  fs.writeFileSync(stampFile, `${stamp}\n`);
  return true;
}

/** Bundles server/index.ts when the server's sources changed. Source maps sit beside the bundle for
 * `node --enable-source-maps`; they are not switched on by default, as mapping every stack Sequelize
 * captures per query costs CPU on every request. */
export function buildServerIfChanged(force = false): boolean {
  const stamp = stampOf(SERVER_INPUTS);
  const stampFile = path.join(SERVER_DIR, '.build-stamp');
  if (!force && upToDate(SERVER_ENTRY, stampFile, stamp)) return false;
  fs.rmSync(SERVER_DIR, { recursive: true, force: true });
  buildSync({
    absWorkingDir: root,
    entryPoints: ['server/index.ts'],
    outfile: SERVER_ENTRY,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    // Packages stay in node_modules and load as Node loads them; only our TypeScript is bundled.
    packages: 'external',
    sourcemap: 'linked',
    logLevel: 'warning',
  });
  fs.writeFileSync(stampFile, `${stamp}\n`);
  return true;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const force = process.argv.includes('--force');
  if (!process.argv.includes('--server-only')) {
    const t0 = Date.now();
    const rebuilt = buildIfChanged(force);
    console.log(rebuilt ? `Built the client (${((Date.now() - t0) / 1000).toFixed(1)} s)` : 'The client is up to date; no build needed');
  }
  if (!process.argv.includes('--client-only')) {
    const t0 = Date.now();
    const rebuilt = buildServerIfChanged(force);
    console.log(rebuilt ? `Bundled the server (${((Date.now() - t0) / 1000).toFixed(1)} s)` : 'The server bundle is up to date');
  }
}
