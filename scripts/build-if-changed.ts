/**
 * `npm start` runs this before the server: it builds the client only when what the build reads has
 * changed since the last build. A hash of those files (paths and contents) is kept beside the build
 * in dist/.build-stamp; a checkout or an edit that changes nothing the build reads costs no build.
 *
 *   tsx scripts/build-if-changed.ts [--force]
 */
import { createHash } from 'node:crypto';
import { execSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
/** Everything `vite build` reads: the client, the shared code, the page, the config, the locked packages. */
const INPUTS = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'tsconfig.json', 'package-lock.json'];
const stampFile = path.join(root, 'dist', '.build-stamp');

function* files(p: string): Generator<string> {
  if (!fs.existsSync(p)) return;
  const st = fs.statSync(p);
  if (st.isFile()) {
    yield p;
    return;
  }
  for (const name of fs.readdirSync(p).sort()) yield* files(path.join(p, name));
}

export function sourceStamp(): string {
  const h = createHash('sha256');
  for (const input of INPUTS) {
    for (const f of files(path.join(root, input))) {
      h.update(path.relative(root, f));
      h.update('\0');
      h.update(fs.readFileSync(f));
      h.update('\0');
    }
  }
  return h.digest('hex');
}

export function buildIfChanged(force = false): boolean {
  const stamp = sourceStamp();
  const built = fs.existsSync(path.join(root, 'dist', 'index.html')) && fs.existsSync(stampFile) && fs.readFileSync(stampFile, 'utf8').trim() === stamp;
  if (built && !force) return false;
  execSync('npx vite build --logLevel warn', { stdio: 'inherit', cwd: root });
  fs.writeFileSync(stampFile, `${stamp}\n`);
  return true;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const t0 = Date.now();
  const rebuilt = buildIfChanged(process.argv.includes('--force'));
  console.log(rebuilt ? `Built the client (${((Date.now() - t0) / 1000).toFixed(1)} s)` : 'The client is up to date; no build needed');
}
