/**
 * Page-load benchmark in headless Chromium: largest contentful paint (LCP) and layout shift (CLS) of
 * the main pages, against a baseline of the bare index.html shell served by the same server, side by
 * side in one run. web.dev's Core Web Vitals call LCP ≤ 2.5 s and CLS ≤ 0.1 "good" (at the 75th
 * percentile of real visits; a loopback run is only a lower bound).
 *
 *   npx tsx bench/page-load.ts
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type Page } from 'playwright-core';

const port = 3620;
const base = `http://127.0.0.1:${port}`;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-bench-'));

async function waitFor(url: string, ms = 60_000) {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`server did not start at ${url}`);
}

async function measure(page: Page, url: string) {
  await page.goto(url, { waitUntil: 'networkidle' });
  return page.evaluate(
    () =>
      new Promise<{ lcp: number; cls: number }>((resolve) => {
        let lcp = 0;
        let cls = 0;
        new PerformanceObserver((l) => l.getEntries().forEach((e) => (lcp = Math.max(lcp, e.startTime)))).observe({ type: 'largest-contentful-paint', buffered: true });
        new PerformanceObserver((l) =>
          l.getEntries().forEach((e) => {
            const shift = e as PerformanceEntry & { value: number; hadRecentInput: boolean };
            if (!shift.hadRecentInput) cls += shift.value;
          }),
        ).observe({ type: 'layout-shift', buffered: true });
        setTimeout(() => resolve({ lcp, cls }), 300);
      }),
  );
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

const server = spawn('npx', ['tsx', 'server/index.ts'], {
  env: { ...process.env, PORT: String(port), DATABASE_PATH: path.join(dir, 'b.sqlite'), UPLOAD_DIR: path.join(dir, 'up'), MAIL_CATCHER_PORT: '2660', SCRYPT_LOG_N: '12' },
  stdio: 'ignore',
  // Its own process group, so the whole tree (npx, tsx, node) stops with it.
  detached: true,
});
try {
  if (!fs.existsSync('dist/index.html')) throw new Error('build the client first: npm run build');
  await waitFor(`${base}/api/health`);
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking'] });
  const pages = ['/', '/planner', '/sign-in'];
  const runs = 5;
  console.log(`page-load (median of ${runs} cold loads each; baseline: /api/health as a document)\n`);
  for (const p of pages) {
    const lcp: number[] = [];
    const cls: number[] = [];
    const baseLcp: number[] = [];
    for (let i = 0; i < runs; i++) {
      // A fresh context each time: a cold cache, as a first visit.
      const ctx = await browser.newContext();
      const page = await ctx.newPage();
      const m = await measure(page, base + p);
      lcp.push(m.lcp);
      cls.push(m.cls);
      await ctx.close();
      const ctx2 = await browser.newContext();
      const page2 = await ctx2.newPage();
      baseLcp.push((await measure(page2, `${base}/api/health`)).lcp);
      await ctx2.close();
    }
    const l = median(lcp);
    const b = median(baseLcp);
    console.log(`${p.padEnd(12)} LCP ${l.toFixed(0).padStart(5)} ms (good ≤ 2500)   CLS ${median(cls).toFixed(3)} (good ≤ 0.1)   vs baseline LCP ${b.toFixed(0)} ms: ratio ${(l / Math.max(b, 1)).toFixed(2)}×`);
  }
  await browser.close();
} finally {
  if (server.pid) process.kill(-server.pid, 'SIGTERM');
  fs.rmSync(dir, { recursive: true, force: true });
}
