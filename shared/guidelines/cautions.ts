import type { Population } from '../schemas/blanket';
import { toCm } from '../sizing/units';
import { COMMON_PRACTICE } from './size-categories';
import { formatCm, isInfantPopulation } from './wording';

export interface Caution {
  id: string;
  text: string;
  source: string;
}

export const AAP_SAFE_SLEEP_2022 =
  'American Academy of Pediatrics, "Sleep-Related Infant Deaths: Updated 2022 Recommendations for Reducing Infant Deaths in the Sleep Environment", Pediatrics 150(1), 2022';
export const CPSC_SMALL_PARTS = 'US CPSC small parts rule, 16 CFR 1501';
export const CPSC_CORDS_5095 = 'CPSC, "Strings, Cords, and Necklaces Can Strangle Infants" (doc 5095)';
export const DRIVE_POLICY = 'our own policy (no published source)';

/** The small-parts test cylinder, in inches as the rule states them. */
export const SMALL_PARTS_CYLINDER_IN = { diameter: 1.25, shortDepth: 1.0, longDepth: 2.25 } as const;

const cm = (inches: number) => formatCm(toCm(inches, 'in'));
const cyl = SMALL_PARTS_CYLINDER_IN;

const INFANT_CAUTIONS: Caution[] = [
  {
    id: 'infant.supervised-only',
    text:
      "A blanket is for cuddles and tummy time while a grown-up is watching. Never leave it loose in a baby's sleep space: babies sleep on their backs on a firm, bare surface.",
    source: AAP_SAFE_SLEEP_2022,
  },
  {
    id: 'infant.small-parts',
    text:
      `Nothing on the blanket may come off and be small enough to fit the small-parts test cylinder: ` +
      `${cyl.diameter.toFixed(2)} in (about ${cm(cyl.diameter)} cm) across and ${cyl.shortDepth.toFixed(2)} to ` +
      `${cyl.longDepth.toFixed(2)} in (about ${cm(cyl.shortDepth)} to ${cm(cyl.longDepth)} cm) deep. ` +
      'Buttons, beads and safety eyes are what to watch for.',
    source: CPSC_SMALL_PARTS,
  },
  {
    id: 'infant.no-cords',
    text: "No cords, ribbons or long loops of yarn that could wrap around a baby's neck, fingers or toes.",
    source: CPSC_CORDS_5095,
  },
  {
    id: 'infant.open-stitches',
    text: 'Keep stitches close: holes that a small finger or toe can pass through can trap it.',
    source: COMMON_PRACTICE,
  },
];

const ELDER_CAUTIONS: Caution[] = [
  {
    id: 'elder.no-trailing-fringe',
    text:
      'Keep edges neat and short: fringe or anything that trails can catch in wheelchair wheels or on a walker and pull someone off balance.',
    source: COMMON_PRACTICE,
  },
  {
    id: 'elder.hot-wash',
    text: 'Care homes wash at high temperatures to keep infections down, so choose yarn that stands a hot wash and a dryer.',
    source: COMMON_PRACTICE,
  },
];

const FACILITY_POLICY: Caution = {
  id: 'facility-policy',
  text: "These are the drive's own guidelines. The receiving facility's policy and local rules always come first.",
  source: DRIVE_POLICY,
};

/** The cautions to show wherever a blanket for this population is planned, logged or checked. */
export function cautionsFor(population: Population): Caution[] {
  const specific = isInfantPopulation(population)
    ? INFANT_CAUTIONS
    : population === 'elder'
      ? ELDER_CAUTIONS
      : [];
  return [...specific, FACILITY_POLICY].map((c) => ({ ...c }));
}
