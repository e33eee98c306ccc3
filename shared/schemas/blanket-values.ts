/**
 * The blanket vocabulary (yarn weights, fibres, features, sizes, who a recipient serves, stitches,
 * statuses) and the picker of the guideline-check fields, without zod: a page that only shows or
 * lists these values loads none of the schema library. ./blanket.ts re-exports them, so the server and the schemas keep importing from there.
 */
import type { BlanketFields } from './blanket';

/** Craft Yarn Council Standard Yarn Weight System categories, 0 (lace) to 7 (jumbo). */
export const YARN_WEIGHTS = [0, 1, 2, 3, 4, 5, 6, 7] as const;

export const FIBRES = [
  'acrylic',
  'cotton',
  'wool',
  'superwash-wool',
  'acrylic-blend',
  'cotton-blend',
  'wool-blend',
  'bamboo',
  'polyester',
  'chenille',
  'nylon',
  'alpaca',
  'mohair',
  'silk',
  'other',
] as const;

export const FEATURES = [
  'fringe',
  'tassels',
  'pompoms',
  'buttons',
  'beads',
  'applique',
  'ribbons',
  'open-lace',
] as const;

export const SIZE_CATEGORIES = ['preemie', 'baby', 'crib', 'child', 'teen', 'lap', 'throw', 'twin'] as const;

export const POPULATIONS = ['preemie', 'infant', 'child', 'teen', 'adult', 'elder'] as const;

/** Who a recipient serves, as a badge or a form option says it. */
export const POPULATION_LABELS: Record<(typeof POPULATIONS)[number], string> = {
  preemie: 'Premature and newborn babies',
  infant: 'Babies and toddlers',
  child: 'Children',
  teen: 'Teenagers',
  adult: 'Adults',
  elder: 'Older people in care',
};

export const BODY_STITCHES = [
  'sc',
  'hdc',
  'dc',
  'granny',
  'ripple',
  'moss',
  'shell',
  'knit-garter',
  'knit-stockinette',
  'other',
] as const;

export const BLANKET_STATUSES = [
  'in_progress',
  'finished',
  'booked',
  'received',
  'checked',
  'needs_fix',
  'declined',
  'assigned',
  'packed',
  'delivered',
] as const;

/** Largest measured side we accept, in cm: past this it is a typing mistake, not a blanket. */
export const MAX_SIDE_CM = 400;

/**
 * Only the guideline-check fields of a stored blanket or a view of one, so a check never sees the
 * rest of the row. The types stay the source's own: a view may carry fibres as plain strings.
 */
export function pickBlanketFields<T extends Record<keyof BlanketFields, unknown>>(b: T): Pick<T, keyof BlanketFields> {
  return {
    widthCm: b.widthCm,
    lengthCm: b.lengthCm,
    yarnWeight: b.yarnWeight,
    fibres: b.fibres,
    features: b.features,
    machineWashable: b.machineWashable,
    dryerSafe: b.dryerSafe,
    smokeFree: b.smokeFree,
    petFree: b.petFree,
    newYarn: b.newYarn,
  };
}
