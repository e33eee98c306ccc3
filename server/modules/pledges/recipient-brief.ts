import type { Transaction } from 'sequelize';
import { Recipient } from '../../db/models/recipient';
import type { RecipientBrief } from '@shared/schemas/pledge';
import { describeGuidelines } from '@shared/guidelines/describe';
import { cautionsFor } from '@shared/guidelines/cautions';
import { storedGuidelines } from '../recipients/recipients.service';

/** A recipient's stored guideline set, read the way the recipients area reads it (defaults when it no longer parses). */
export const guidelinesOf = storedGuidelines;

/**
 * Briefs already built, keyed by the recipient's id, version and last change: parsing and
 * describing a guideline set per row of a list is most of a list's cost, and the recipients are few.
 */
const briefs = new Map<string, RecipientBrief>();
const MAX_BRIEFS = 500;

/** What a brief reads of a recipient: an instance or the plain values of a list's row. */
export type BriefSource = Pick<Recipient, 'id' | 'version' | 'updatedAt' | 'name' | 'kind' | 'population' | 'guidelines'>;

export function recipientBrief(r: BriefSource): RecipientBrief {
  const key = `${r.id}:${r.version}:${new Date(r.updatedAt).getTime()}`;
  const known = briefs.get(key);
  if (known) return known;
  const brief = buildBrief(r);
  if (briefs.size >= MAX_BRIEFS) briefs.clear();
  briefs.set(key, brief);
  return brief;
}

function buildBrief(r: BriefSource): RecipientBrief {
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

export function addDaysIso(day: string, days: number): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}
