import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Client, makeTestApp, type TestApp } from './test-app';
import { planBorder } from '@shared/border/plan';

let t: TestApp;
let anon: Client;
beforeAll(async () => {
  t = await makeTestApp({ seed: false });
  anon = new Client(t.app);
  await anon.refreshToken();
});
afterAll(async () => t.close());

const fit = (body: object) => anon.post('/api/tools/border-fit', body);

describe('POST /api/tools/border-fit', () => {
  // Worked check values of the issue: common practice, done by hand (multiple 4 plus 1).
  it('fits 30 across × 23 rows to a multiple of 4 plus 1: +3 on top and bottom, +2 on the sides', async () => {
    const res = await fit({ across: 30, rows: 23, multiple: 4, offset: 1, strategy: 'add' });
    expect(res.status).toBe(200);
    const { edges } = res.body;
    expect(edges.top).toMatchObject({ count: 30, change: 3, fitted: 33, repeats: 8 });
    expect(edges.bottom).toMatchObject({ count: 30, change: 3, fitted: 33, repeats: 8 });
    expect(edges.right).toMatchObject({ count: 23, change: 2, fitted: 25, repeats: 6 });
    expect(edges.left).toMatchObject({ count: 23, change: 2, fitted: 25, repeats: 6 });
    expect(edges.top.positions).toHaveLength(3);
    expect(edges.right.positions).toHaveLength(2);
    expect(res.body.sentences.top).toMatch(/^Top edge: work 2 hdc in the /);
    expect(res.body.round.total).toBe(33 * 2 + 25 * 2 + 12);
  });

  it('needs no change for 25 across × 17 rows (common practice, done by hand)', async () => {
    const res = await fit({ across: 25, rows: 17, multiple: 4, offset: 1 });
    expect(res.status).toBe(200);
    for (const edge of ['top', 'right', 'bottom', 'left']) {
      expect(res.body.edges[edge].change).toBe(0);
      expect(res.body.edges[edge].positions).toEqual([]);
    }
  });

  it('answers exactly what the shared engine answers, so the browser and the API agree', async () => {
    const body = { across: 57, rows: { count: 41, pattern: ['sc', 'dc'] as ('sc' | 'dc')[] }, multiple: 6, offset: 1, strategy: 'fewest' as const, mode: 'continuous' as const };
    const res = await fit(body);
    expect(res.status).toBe(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(planBorder(body))));
  });

  it('counts row ends from the row-type pattern: sc rows take 1, dc rows take 2 (common practice)', async () => {
    // 23 rows of sc, dc, sc, ...: 12 sc rows and 11 dc rows = 12 + 22 = 34 stitches a side.
    const res = await fit({ across: 30, rows: { count: 23, pattern: ['sc', 'dc'] }, multiple: 4, offset: 1 });
    expect(res.status).toBe(200);
    expect(res.body.edges.right).toMatchObject({ count: 34, change: 3, fitted: 37 });
  });

  it("with 'fewest' skips when that changes fewer stitches, and adds on a tie", async () => {
    const res = await fit({ across: 30, rows: 23, multiple: 4, offset: 1, strategy: 'fewest' });
    expect(res.body.edges.top).toMatchObject({ change: -1, fitted: 29 });
    expect(res.body.edges.right).toMatchObject({ change: 2, fitted: 25 });
    expect(res.body.sentences.top).toMatch(/skip the/);
  });

  it('closes a continuous round on a whole number of repeats', async () => {
    const res = await fit({ across: 30, rows: 23, multiple: 4, offset: 1, mode: 'continuous' });
    expect(res.status).toBe(200);
    expect(res.body.mode).toBe('continuous');
    expect(res.body.round.total % 4).toBe(0);
  });

  it('needs no sign-in', async () => {
    const me = await anon.get('/api/auth/me');
    expect(me.status).toBe(401);
    expect((await fit({ across: 42, rows: 31, multiple: 4, offset: 1 })).status).toBe(200);
  });

  it('still refuses a write without the CSRF token', async () => {
    const res = await request(t.app).post('/api/tools/border-fit').send({ across: 42, rows: 31, multiple: 4, offset: 1 });
    expect(res.status).toBe(403);
  });

  const good = { across: 30, rows: 23, multiple: 4, offset: 1 };
  const bad: Array<[string, object, string]> = [
    ['negative across', { ...good, across: -4 }, 'across'],
    ['zero across', { ...good, across: 0 }, 'across'],
    ['fractional across', { ...good, across: 30.5 }, 'across'],
    ['across over 2,000', { ...good, across: 2001 }, 'across'],
    ['across as text', { ...good, across: '30' }, 'across'],
    ['missing across', { rows: 23, multiple: 4, offset: 1 }, 'across'],
    ['zero rows', { ...good, rows: 0 }, 'rows'],
    ['rows over 2,000', { ...good, rows: 2400 }, 'rows'],
    ['fractional rows', { ...good, rows: 2.5 }, 'rows'],
    ['rows as text', { ...good, rows: 'twenty' }, 'rows'],
    ['a rows count over 2,000', { ...good, rows: { count: 2001, pattern: ['sc'] } }, 'rows.count'],
    ['an unknown row type', { ...good, rows: { count: 20, pattern: ['sc', 'puff'] } }, 'rows.pattern.1'],
    ['an empty row pattern', { ...good, rows: { count: 20, pattern: [] } }, 'rows.pattern'],
    ['multiple 1', { ...good, multiple: 1 }, 'multiple'],
    ['fractional multiple', { ...good, multiple: 4.5 }, 'multiple'],
    ['negative offset', { ...good, offset: -1 }, 'offset'],
    ['an unknown strategy', { ...good, strategy: 'most' }, 'strategy'],
    ['an unknown mode', { ...good, mode: 'spiral' }, 'mode'],
    ['a centre outside the repeat', { ...good, centre: 4 }, 'centre'],
  ];
  for (const [what, body, field] of bad) {
    it(`answers 400 naming ${field} for ${what}`, async () => {
      const res = await fit(body);
      expect(res.status).toBe(400);
      expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
      expect(res.body.error.message).toMatch(new RegExp(`^${field.replace(/\./g, '\\.')}`));
    });
  }
});

describe('POST /api/tools/size-from-gauge and /api/tools/yarn-estimate', () => {
  it('gives starting counts rounded to the body pattern multiple', async () => {
    const res = await anon.post('/api/tools/size-from-gauge', {
      gauge: { stitches: 14, rows: 10, over: 10, unit: 'cm' },
      target: { width: 80, length: 100, unit: 'cm' },
      borderDepth: 3,
      bodyStitch: 'hdc',
      stitchMultiple: 2,
      stitchOffset: 1,
    });
    expect(res.status).toBe(200);
    // (80 − 2·3) cm × 1.4 st/cm = 103.6 → nearest 2k + 1 is 103.
    expect(res.body.stitches).toBe(103);
    expect(res.body.rows).toBe(94);
    expect(res.body.startingChain.chains).toBe(104);
  });

  it('names the field of a bad gauge', async () => {
    const res = await anon.post('/api/tools/size-from-gauge', {
      gauge: { stitches: 0, rows: 10, over: 10, unit: 'cm' },
      target: { width: 80, length: 100, unit: 'cm' },
      borderDepth: 3,
      bodyStitch: 'hdc',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('gauge.stitches');
  });

  it('estimates yarn with the margin and counts whole skeins', async () => {
    const res = await anon.post('/api/tools/yarn-estimate', {
      body: { width: 30, length: 40, unit: 'in' },
      yarnWeight: 4,
      margin: 0.1,
      skein: { length: 200, unit: 'yd' },
    });
    expect(res.status).toBe(200);
    // 1,200 sq in × 0.87 yd (rule of thumb, REFERENCES.md) = 1,044 yd; +10 % = 1,148.4 → 1,149 yd; 6 skeins of 200 yd.
    expect(res.body.totalYards).toBe(1149);
    expect(res.body.skeins).toBe(6);
    expect(res.body.note).toMatch(/rule of thumb/i);
  });

  it('refuses lace, which has no per-area estimate', async () => {
    const res = await anon.post('/api/tools/yarn-estimate', { body: { width: 30, length: 40, unit: 'in' }, yarnWeight: 0 });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('yarnWeight');
  });
});
