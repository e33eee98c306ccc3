import type { Transaction } from 'sequelize';
import { Recipient } from '../../db/models/recipient';
import { notFound } from '../../lib/http-error';
import { check } from '@shared/guidelines/check';
import { cautionsFor, type Caution } from '@shared/guidelines/cautions';
import type { BlanketFields, Population } from '@shared/schemas/blanket';
import type { GuidelineCheckResult, GuidelineSet } from '@shared/schemas/guidelines';
import { activeRecipientGuidelines, storedGuidelines } from '../recipients/recipients.service';

export interface CheckAnswer extends GuidelineCheckResult {
  recipient: { id: number; name: string; population: Population; active: boolean };
  guidelines: GuidelineSet;
  cautions: Caution[];
}

/**
 * Runs the guideline check against one recipient, with every other active recipient as a
 * candidate for `alsoFits`. Pass the transaction when called from inside one: the database has a
 * single connection, so a query outside it would wait for it forever.
 */
export async function checkAgainst(
  recipientId: number,
  blanket: BlanketFields,
  transaction?: Transaction,
  opts: { activeOnly?: boolean } = {},
): Promise<CheckAnswer> {
  const r = await Recipient.findByPk(recipientId, { transaction });
  // Makers see only recipients that are collecting: an inactive one is "not found" to them, like one that never was.
  if (!r || (opts.activeOnly && !r.active)) throw notFound('That recipient');
  const guidelines = storedGuidelines(r);
  const others = await activeRecipientGuidelines(transaction);
  const result = check(blanket, guidelines, others, { recipientId: r.id });
  return {
    ...result,
    recipient: { id: r.id, name: r.name, population: r.population, active: r.active },
    guidelines,
    cautions: cautionsFor(guidelines.population),
  };
}
