import { fn, col } from 'sequelize';
import { Blanket } from '../../db/models/blanket';
import { Plan } from '../../db/models/plan';
import { HttpError, notFound } from '../../lib/http-error';
import { MAX_PLANS_PER_MAKER, PlanInputSchema, type PlanCreate, type PlanDetail, type PlanInput, type PlanListItem, type PlanSummary } from '@shared/schemas/plan';
import { summarisePlan } from './plan-summary';

function listItem(p: Plan, blankets: number): PlanListItem {
  const input = p.input as unknown as PlanInput;
  return {
    id: p.id,
    name: p.name,
    borderId: input.borderId,
    summary: p.summary as unknown as PlanSummary,
    blankets,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}

async function blanketCounts(planIds: number[]): Promise<Map<number, number>> {
  if (planIds.length === 0) return new Map();
  const rows = (await Blanket.findAll({
    attributes: ['planId', [fn('COUNT', col('id')), 'n']],
    where: { planId: planIds },
    group: ['planId'],
    raw: true,
  })) as unknown as Array<{ planId: number; n: number }>;
  return new Map(rows.map((r) => [r.planId, Number(r.n)]));
}

/** Newest first: the plan a maker just saved is the one they are about to attach. */
export async function listPlans(userId: number): Promise<PlanListItem[]> {
  const plans = await Plan.findAll({ where: { userId }, order: [['updatedAt', 'DESC'], ['id', 'DESC']] });
  const counts = await blanketCounts(plans.map((p) => p.id));
  return plans.map((p) => listItem(p, counts.get(p.id) ?? 0));
}

/** Someone else's plan answers exactly like a missing one, so ids reveal nothing. */
async function ownPlan(userId: number, id: number): Promise<Plan> {
  const plan = await Plan.findOne({ where: { id, userId } });
  if (!plan) throw notFound('That plan');
  return plan;
}

export async function getPlan(userId: number, id: number): Promise<PlanDetail> {
  const plan = await ownPlan(userId, id);
  const counts = await blanketCounts([plan.id]);
  // Re-parse on the way out so defaults added to the schema later reach old rows too.
  return { ...listItem(plan, counts.get(plan.id) ?? 0), input: PlanInputSchema.parse(plan.input) };
}

export async function createPlan(userId: number, body: PlanCreate): Promise<PlanDetail> {
  const existing = await Plan.count({ where: { userId } });
  if (existing >= MAX_PLANS_PER_MAKER) {
    throw new HttpError(409, `You already have ${MAX_PLANS_PER_MAKER} saved plans; delete some you no longer need first`);
  }
  const summary = summarisePlan(body.input);
  // The JSON columns are typed as plain records; the schema and summary types are what they hold.
  const plan = await Plan.create({ userId, name: body.name, input: body.input, summary: summary as unknown as Record<string, unknown> });
  return { ...listItem(plan, 0), input: body.input };
}

/** Blankets that name the plan keep their own record; the foreign key sets their planId to null. */
export async function deletePlan(userId: number, id: number): Promise<void> {
  const plan = await ownPlan(userId, id);
  await plan.destroy();
}
