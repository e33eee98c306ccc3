import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, signedIn, type Client, type TestApp } from './test-app';
import { Blanket } from '../../server/db/models/blanket';
import { User } from '../../server/db/models/user';
import { borderById } from '@shared/border/library';
import { finishedSizeFromCounts } from '@shared/sizing/gauge';
import { estimateYarn } from '@shared/sizing/yarn-estimate';
import type { PlanDetail, PlanListItem } from '@shared/schemas/plan';

let t: TestApp;
let tobias: Client;
let ines: Client;
beforeAll(async () => {
  t = await makeTestApp();
  tobias = await signedIn(t.app, 'tobias@example.org');
  ines = await signedIn(t.app, 'ines@example.org');
});
afterAll(async () => t.close());

const input = { across: 30, rows: 23, borderId: 'five-dc-shell', strategy: 'add' };

async function save(c: Client, name: string, body: object = input) {
  const res = await c.post('/api/plans', { name, input: body });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.plan as PlanDetail;
}

describe('saved plans', () => {
  it('refuses anyone not signed in', async () => {
    const agent = request.agent(t.app);
    const token = (await agent.get('/api/auth/csrf')).body.csrfToken;
    expect((await agent.get('/api/plans')).status).toBe(401);
    expect((await agent.post('/api/plans').set('X-CSRF-Token', token).send({ name: 'x', input })).status).toBe(401);
    expect((await agent.get('/api/plans/1')).status).toBe(401);
    expect((await agent.delete('/api/plans/1').set('X-CSRF-Token', token)).status).toBe(401);
  });

  it('saves a plan and works the summary out on the server', async () => {
    const plan = await save(tobias, 'Shell border for the ward blanket');
    expect(plan).toMatchObject({ name: 'Shell border for the ward blanket', borderId: 'five-dc-shell', blankets: 0 });
    // 30 × 23 to a multiple of 4 plus 1: +3 / +2 (common practice, done by hand).
    expect(plan.summary.edges).toEqual({
      top: { count: 30, change: 3, fitted: 33 },
      right: { count: 23, change: 2, fitted: 25 },
      bottom: { count: 30, change: 3, fitted: 33 },
      left: { count: 23, change: 2, fitted: 25 },
    });
    expect(plan.summary).toMatchObject({ borderName: 'Five-dc shell', multiple: 4, offset: 1, roundTotal: 128, repeats: 32, rows: 23, rowPattern: null });
    expect(plan.summary.text).toBe('Five-dc shell · 30 × 23 rows · top and bottom +3, sides +2');
    expect(plan.summary.finished).toBeNull();
    expect(plan.input).toMatchObject({ ...input, mode: 'per-edge', terms: 'us' });
  });

  it('ignores a summary the client sends and trims the name', async () => {
    const res = await tobias.post('/api/plans', { name: '  Trimmed  ', input, summary: { text: 'made up' } });
    expect(res.status).toBe(201);
    expect(res.body.plan.name).toBe('Trimmed');
    expect(res.body.plan.summary.text).not.toBe('made up');
  });

  it('adds the finished size and the yarn when the plan has a gauge and a yarn', async () => {
    const gauge = { stitches: 15, rows: 11, over: 10, unit: 'cm' as const };
    const body = {
      across: 106,
      rows: { count: 78, pattern: ['sc', 'dc'] },
      borderId: 'wide-scallop',
      gauge,
      borderDepth: 3.5,
      yarn: { weight: 4, margin: 0.15, skein: { length: 180, unit: 'm' } },
    };
    const plan = await save(tobias, 'Scallop throw', body);
    const size = finishedSizeFromCounts({ gauge, stitches: 106, rows: 78, borderDepth: 3.5, unit: 'cm' });
    const yarn = estimateYarn({ body: size.body, yarnWeight: 4, border: { depth: 3.5, yarnFactor: borderById('wide-scallop')!.yarnFactor }, margin: 0.15, skein: { length: 180, unit: 'm' } });
    expect(plan.summary.finished).toEqual({ width: Math.round(size.finished.width * 10) / 10, length: Math.round(size.finished.length * 10) / 10, unit: 'cm' });
    // 106 / 1.5 + 7 = 77.7 cm wide: a plain sanity check beside the engine's own answer.
    expect(plan.summary.finished!.width).toBeCloseTo(77.7, 1);
    expect(plan.summary.yarn).toEqual({ metres: yarn.totalMetres, yards: yarn.totalYards, skeins: yarn.skeins });
    expect(plan.summary.rowPattern).toEqual(['sc', 'dc']);
    // 39 sc rows + 39 dc rows = 117 stitches a side.
    expect(plan.summary.edges.right.count).toBe(117);
  });

  it("lists only the maker's own plans, newest first, with id, name, border and summary", async () => {
    const mine = await save(ines, 'Picot ribbon baby blanket', { ...input, borderId: 'picot-ribbon' });
    const list = (await ines.get('/api/plans')).body.plans as PlanListItem[];
    expect(list.map((p) => p.id)).toEqual([mine.id]);
    expect(Object.keys(list[0]!).sort()).toEqual(['blankets', 'borderId', 'createdAt', 'id', 'name', 'summary', 'updatedAt']);
    expect(list[0]).toMatchObject({ name: 'Picot ribbon baby blanket', borderId: 'picot-ribbon' });

    const theirs = (await tobias.get('/api/plans')).body.plans as PlanListItem[];
    expect(theirs.length).toBeGreaterThanOrEqual(3);
    expect(theirs.map((p) => p.id)).not.toContain(mine.id);
    expect(theirs[0]!.name).toBe('Scallop throw');
  });

  it("answers 404 for someone else's plan, to read or to delete, and leaves it alone", async () => {
    const mine = await save(ines, 'Not for sharing');
    expect((await tobias.get(`/api/plans/${mine.id}`)).status).toBe(404);
    expect((await tobias.delete(`/api/plans/${mine.id}`)).status).toBe(404);
    const organiser = await signedIn(t.app, 'organiser');
    expect((await organiser.get(`/api/plans/${mine.id}`)).status).toBe(404);
    const back = await ines.get(`/api/plans/${mine.id}`);
    expect(back.status).toBe(200);
    expect(back.body.plan.input).toMatchObject(input);
  });

  it('deletes a plan and unlinks the blankets that named it', async () => {
    const plan = await save(tobias, 'To be deleted');
    const user = await User.findOne({ where: { email: 'tobias@example.org' } });
    const blanket = await Blanket.create({
      code: 'PLNTST01',
      userId: user!.id,
      planId: plan.id,
      widthCm: 80,
      lengthCm: 100,
      yarnWeight: 4,
      fibres: ['acrylic'],
      machineWashable: true,
      smokeFree: true,
      petFree: true,
    });
    const listed = ((await tobias.get('/api/plans')).body.plans as PlanListItem[]).find((p) => p.id === plan.id);
    expect(listed?.blankets).toBe(1);

    expect((await tobias.delete(`/api/plans/${plan.id}`)).status).toBe(204);
    expect((await tobias.get(`/api/plans/${plan.id}`)).status).toBe(404);
    await blanket.reload();
    expect(blanket.planId).toBeNull();
  });

  const bad: Array<[string, object, string]> = [
    ['an empty name', { name: '   ', input }, 'name'],
    ['a name over 120 characters', { name: 'x'.repeat(121), input }, 'name'],
    ['no input', { name: 'x' }, 'input'],
    ['zero across', { name: 'x', input: { ...input, across: 0 } }, 'input.across'],
    ['across over 2,000', { name: 'x', input: { ...input, across: 2500 } }, 'input.across'],
    ['fractional rows', { name: 'x', input: { ...input, rows: 22.5 } }, 'input.rows'],
    ['an unknown border', { name: 'x', input: { ...input, borderId: 'lace-fan' } }, 'input.borderId'],
    ['an unknown strategy', { name: 'x', input: { ...input, strategy: 'most' } }, 'input.strategy'],
    ['a zero gauge', { name: 'x', input: { ...input, gauge: { stitches: 0, rows: 10, over: 10, unit: 'cm' } } }, 'input.gauge.stitches'],
    ['lace yarn', { name: 'x', input: { ...input, yarn: { weight: 0 } } }, 'input.yarn.weight'],
  ];
  for (const [what, body, field] of bad) {
    it(`answers 400 naming ${field} for ${what}, and saves nothing`, async () => {
      const before = ((await ines.get('/api/plans')).body.plans as unknown[]).length;
      const res = await ines.post('/api/plans', body);
      expect(res.status).toBe(400);
      expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain(field);
      expect(((await ines.get('/api/plans')).body.plans as unknown[]).length).toBe(before);
    });
  }

  it('answers 400 for an id that is not a number', async () => {
    expect((await ines.get('/api/plans/abc')).status).toBe(400);
  });
});

describe('the per-maker limit', () => {
  it('refuses a plan past the limit with 409 and keeps the others', async () => {
    const { Plan } = await import('../../server/db/models/plan');
    const { MAX_PLANS_PER_MAKER } = await import('@shared/schemas/plan');
    const c = await signedIn(t.app, 'priya@example.org');
    const user = await User.findOne({ where: { email: 'priya@example.org' } });
    const first = await save(c, 'Kept');
    await Plan.bulkCreate(
      Array.from({ length: MAX_PLANS_PER_MAKER - 1 }, (_, i) => ({ userId: user!.id, name: `Filler ${i}`, input: { ...input }, summary: first.summary as unknown as Record<string, unknown> })),
    );
    const res = await c.post('/api/plans', { name: 'One too many', input });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/delete some/);
    expect(((await c.get('/api/plans')).body.plans as unknown[]).length).toBe(MAX_PLANS_PER_MAKER);
  });
});
