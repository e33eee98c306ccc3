/**
 * `npm test`: unit, API and reference tests (Vitest), then the browser tests (Playwright), then one
 * closing line with the real totals of both runners: "N passed, N failed".
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';

fs.mkdirSync('test-results', { recursive: true });
const vitestJson = 'test-results/vitest.json';
const e2eJson = 'test-results/e2e.json';
for (const f of [vitestJson, e2eJson]) fs.rmSync(f, { force: true });

const run = (cmd: string, args: string[], env: Record<string, string> = {}) =>
  spawnSync(cmd, args, { stdio: 'inherit', env: { ...process.env, ...env } }).status ?? 1;

const vitestStatus = run('npx', ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${vitestJson}`]);
const e2eStatus = run('npx', ['playwright', 'test'], { PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1' });

let passed = 0;
let failed = 0;
let skipped = 0;
if (fs.existsSync(vitestJson)) {
  const v = JSON.parse(fs.readFileSync(vitestJson, 'utf8'));
  passed += v.numPassedTests;
  failed += v.numFailedTests;
  skipped += (v.numPendingTests ?? 0) + (v.numTodoTests ?? 0);
  // A test file that fails to load has no tests counted; count it as a failure.
  if (vitestStatus !== 0 && v.numFailedTests === 0) failed += Math.max(1, v.numFailedTestSuites ?? 0);
} else if (vitestStatus !== 0) failed += 1;
if (fs.existsSync(e2eJson)) {
  const e = JSON.parse(fs.readFileSync(e2eJson, 'utf8'));
  passed += (e.stats?.expected ?? 0) + (e.stats?.flaky ?? 0);
  failed += e.stats?.unexpected ?? 0;
  skipped += e.stats?.skipped ?? 0;
  if (e2eStatus !== 0 && !(e.stats?.unexpected > 0)) failed += 1;
} else if (e2eStatus !== 0) failed += 1;

console.log(`\n${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(vitestStatus === 0 && e2eStatus === 0 && failed === 0 ? 0 : 1);
