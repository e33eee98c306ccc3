import type { Transaction } from 'sequelize';
import { Recipient } from '../../db/models/recipient';
import { GuidelineSetSchema, type GuidelineSet } from '../../../shared/schemas/guidelines';
import type { RecipientBrief } from '../../../shared/schemas/pledge';
import { defaultGuidelines } from '../../../shared/guidelines/defaults';
import { describeGuidelines } from '../../../shared/guidelines/describe';
import { cautionsFor } from '../../../shared/guidelines/cautions';

/**
 * A recipient's guideline set as stored. A row saved before its guidelines were filled in (or
 * with a set that no longer parses) falls back to its population's defaults, so a maker still
 * gets a self-check rather than none.
 */
export function guidelinesOf(r: Pick<Recipient, 'guidelines' | 'population'>): GuidelineSet {
  const parsed = GuidelineSetSchema.safeParse(r.guidelines);
  return parsed.success ? parsed.data : defaultGuidelines(r.population);
}

export function recipientBrief(r: Recipient): RecipientBrief {
  const guidelines = guidelinesOf(r);
  return {
    id: r.id,
    name: r.name,
    kind: r.kind,
    population: r.population,
    guidelines,
    guidelineSummary: describeGuidelines(guidelines),
    cautions: cautionsFor(r.population),
  };
}

export async function activeRecipients(transaction?: Transaction): Promise<Recipient[]> {
  return Recipient.findAll({ where: { active: true }, order: [['name', 'ASC']], transaction });
}

export const todayIso = (now = new Date()): string => now.toISOString().slice(0, 10);

export function addDaysIso(day: string, days: number): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}
