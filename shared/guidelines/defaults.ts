import { FEATURES } from '../schemas/blanket-values';
import type { Feature, Fibre, Population, SizeCategory } from '../schemas/blanket';
import type { GuidelineSet } from '../schemas/guidelines';
import { sizeCategoryRow } from './size-categories';

/** The size span that covers all the given rows, in whole cm, rounded outwards so no row is cut. */
function sizeSpan(categories: readonly SizeCategory[]) {
  const rows = categories.map(sizeCategoryRow);
  return {
    minWidthCm: Math.floor(Math.min(...rows.map((r) => r.rangeCm.minWidth))),
    maxWidthCm: Math.ceil(Math.max(...rows.map((r) => r.rangeCm.maxWidth))),
    minLengthCm: Math.floor(Math.min(...rows.map((r) => r.rangeCm.minLength))),
    maxLengthCm: Math.ceil(Math.max(...rows.map((r) => r.rangeCm.maxLength))),
  };
}

const range = (lo: number, hi: number) => Array.from({ length: hi - lo + 1 }, (_, i) => lo + i);

/** Wool felts and shrinks in a hot wash; mohair and alpaca shed fine hairs. */
const SHEDDING_OR_FELTING: Fibre[] = ['wool', 'wool-blend', 'mohair', 'alpaca'];

/** Soft, hard-wearing fibres that survive a hospital laundry. */
const WASHABLE_SYNTHETICS_AND_COTTON: Fibre[] = ['acrylic', 'cotton', 'acrylic-blend', 'cotton-blend'];

/**
 * Starting points an organiser edits to match what the receiving unit actually asked for.
 * The reasons for each choice sit beside it; every default can be changed.
 */
const DEFAULTS: Record<Population, Omit<GuidelineSet, 'population'>> = {
  // Neonatal units are the strictest: nothing that comes loose, catches or sheds; acrylic or
  // cotton only (many take no wool of any kind, washable or not); light yarn so the blanket
  // stays light; everything laundered hot and tumble-dried.
  preemie: {
    ...sizeSpan(['preemie']),
    toleranceUnit: 'cm',
    toleranceValue: 2,
    yarnWeights: range(1, 4),
    acceptedFibres: WASHABLE_SYNTHETICS_AND_COTTON,
    refusedFibres: [...SHEDDING_OR_FELTING, 'superwash-wool'],
    refusedFeatures: [...FEATURES],
    requireMachineWashable: true,
    requireDryerSafe: true,
    requireSmokeFree: true,
    requirePetFree: true,
    requireNewYarn: true,
  },
  // Babies to toddlers: the same care as preemies, a little more choice of soft fibres and up to
  // bulky yarn; super bulky and jumbo make big stitches that catch fingers and toes.
  infant: {
    ...sizeSpan(['baby', 'crib']),
    toleranceUnit: 'percent',
    toleranceValue: 5,
    yarnWeights: range(1, 5),
    acceptedFibres: [...WASHABLE_SYNTHETICS_AND_COTTON, 'bamboo'],
    refusedFibres: [...SHEDDING_OR_FELTING, 'superwash-wool'],
    refusedFeatures: [...FEATURES],
    requireMachineWashable: true,
    requireDryerSafe: true,
    requireSmokeFree: true,
    requirePetFree: true,
    requireNewYarn: true,
  },
  // Children's wards may hold under-threes, so no small parts and no cords; sturdy fringe, tassels,
  // pompoms and appliqué are allowed because children enjoy them and are old enough for them.
  child: {
    ...sizeSpan(['lap', 'child']),
    toleranceUnit: 'percent',
    toleranceValue: 5,
    yarnWeights: range(2, 6),
    acceptedFibres: [],
    refusedFibres: SHEDDING_OR_FELTING,
    refusedFeatures: ['buttons', 'beads', 'ribbons'],
    requireMachineWashable: true,
    requireDryerSafe: true,
    requireSmokeFree: true,
    requirePetFree: true,
    requireNewYarn: true,
  },
  // Teens are past the choking and strangling risks, so any trim goes; the blanket still has to
  // stand a machine wash and come from a smoke-free home, since smoke stays in yarn.
  teen: {
    ...sizeSpan(['teen', 'throw']),
    toleranceUnit: 'percent',
    toleranceValue: 5,
    yarnWeights: range(2, 7),
    acceptedFibres: [],
    refusedFibres: ['mohair', 'alpaca'],
    refusedFeatures: [],
    requireMachineWashable: true,
    requireDryerSafe: false,
    requireSmokeFree: true,
    requirePetFree: false,
    requireNewYarn: true,
  },
  // Adults (shelters, outreach): the most relaxed. Fringe is allowed: it is a traditional finish
  // and an adult is not at risk from it. Wool is welcome for its warmth. Washable and smoke-free
  // still, because a blanket that can't be washed or smells of smoke can't be handed on.
  adult: {
    ...sizeSpan(['lap', 'throw', 'twin']),
    toleranceUnit: 'percent',
    toleranceValue: 5,
    yarnWeights: range(1, 7),
    acceptedFibres: [],
    refusedFibres: [],
    refusedFeatures: [],
    requireMachineWashable: true,
    requireDryerSafe: false,
    requireSmokeFree: true,
    requirePetFree: false,
    requireNewYarn: false,
  },
  // Frail elders in care: lap size so nothing trails to the floor or the wheels; no fringe,
  // tassels or ribbons that catch in wheelchairs and walkers; no buttons or beads that press into
  // fragile skin or come off; everything stands the home's hot wash and dryer, so no wool that
  // felts. Jumbo yarn makes a blanket too heavy on a frail lap.
  elder: {
    ...sizeSpan(['lap']),
    toleranceUnit: 'percent',
    toleranceValue: 5,
    yarnWeights: range(2, 6),
    acceptedFibres: [],
    refusedFibres: SHEDDING_OR_FELTING,
    refusedFeatures: ['fringe', 'tassels', 'ribbons', 'buttons', 'beads'] satisfies Feature[],
    requireMachineWashable: true,
    requireDryerSafe: true,
    requireSmokeFree: true,
    requirePetFree: false,
    requireNewYarn: true,
  },
};

/** A fresh, editable copy of the default guideline set for a population. */
export function defaultGuidelines(population: Population): GuidelineSet {
  const d = DEFAULTS[population];
  return {
    population,
    ...d,
    yarnWeights: [...d.yarnWeights],
    acceptedFibres: [...d.acceptedFibres],
    refusedFibres: [...d.refusedFibres],
    refusedFeatures: [...d.refusedFeatures],
  };
}
