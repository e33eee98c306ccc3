import { BlanketFieldsSchema, type BlanketFields } from '@shared/schemas/blanket';
import type { RecipientBrief } from '@shared/schemas/pledge';
import { check, evaluate } from '@shared/guidelines/check';
import type { SelfCheck } from './use-self-check';

const FIELD_WORDS: Record<string, string> = {
  widthCm: 'the width',
  lengthCm: 'the length',
  yarnWeight: 'the yarn weight',
  fibres: 'the fibres',
  machineWashable: 'whether it is machine washable',
  smokeFree: 'whether your home is smoke-free',
  petFree: 'whether your home is pet-free',
};

/**
 * The same guideline check the organisers run at intake, run here on what the maker has typed so
 * far. With no recipient yet ("wherever it's needed most") it says which recipients would take it.
 * The blanket form loads this module (and with it zod) once it has painted.
 */
export function runSelfCheck(fields: Partial<BlanketFields>, recipient: RecipientBrief | null, others: RecipientBrief[]): SelfCheck {
  const parsed = BlanketFieldsSchema.safeParse(fields);
  if (!parsed.success) {
    const missing = [...new Set(parsed.error.issues.map((i) => FIELD_WORDS[String(i.path[0])] ?? String(i.path[0])))];
    return { state: 'incomplete', missing };
  }
  const blanket = parsed.data;
  const pool = others.map((r) => ({ recipientId: r.id, name: r.name, guidelines: r.guidelines }));
  if (recipient) return { state: 'checked', recipient, result: check(blanket, recipient.guidelines, pool, { recipientId: recipient.id }) };
  const fits: Array<{ name: string }> = [];
  const nearly: Array<{ name: string }> = [];
  for (const r of others) {
    const reasons = evaluate(blanket, r.guidelines).reasons;
    if (reasons.length === 0) fits.push(r);
    else if (reasons.every((x) => x.fix !== undefined)) nearly.push(r);
  }
  return { state: 'anywhere', fits, nearly };
}
