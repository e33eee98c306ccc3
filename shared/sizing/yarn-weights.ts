/**
 * The Craft Yarn Council's Standard Yarn Weight System, crochet columns only, as data. The
 * council calls the whole table "guidelines only"; we show it as a guide and never reject a
 * blanket for falling outside a range.
 */

export const CYC_SOURCE =
  'Craft Yarn Council — Standard Yarn Weight System (crochet columns), as reprinted in craft magazines (e.g. Crochet World, Oct 2018); guidelines only';

export type YarnWeightCategory = 0 | 1 | 2 | 3 | 4 | 5 | 6 | 7;

export interface Range {
  /** null = the range is open at this end ("5 and fewer", "16 and larger"). */
  min: number | null;
  max: number | null;
}

export interface YarnWeightRow {
  category: YarnWeightCategory;
  name: string;
  typicalYarns: readonly string[];
  /** Stitches per 4 in (10 cm). The lace row is counted in dc, all others in sc. */
  crochetGauge: Range & { stitch: 'sc' | 'dc' };
  hookMm: Range;
  /** As the table prints it, e.g. "I-9 to K-10½". */
  hookUs: string;
  notes: readonly string[];
}

export const YARN_WEIGHTS: readonly YarnWeightRow[] = [
  {
    category: 0,
    name: 'Lace',
    typicalYarns: ['fingering', 'size-10 thread'],
    crochetGauge: { min: 32, max: 42, stitch: 'dc' },
    hookMm: { min: 1.5, max: 2.25 },
    hookUs: 'steel 8 to B-1',
    notes: ['Gauge for this category is given in dc, not sc.'],
  },
  {
    category: 1,
    name: 'Super Fine',
    typicalYarns: ['sock', 'fingering', 'baby'],
    crochetGauge: { min: 21, max: 32, stitch: 'sc' },
    hookMm: { min: 2.25, max: 3.5 },
    hookUs: 'B-1 to E-4',
    notes: [],
  },
  {
    category: 2,
    name: 'Fine',
    typicalYarns: ['sport', 'baby'],
    crochetGauge: { min: 16, max: 20, stitch: 'sc' },
    hookMm: { min: 3.5, max: 4.5 },
    hookUs: 'E-4 to 7',
    notes: [],
  },
  {
    category: 3,
    name: 'Light',
    typicalYarns: ['DK', 'light worsted'],
    crochetGauge: { min: 12, max: 17, stitch: 'sc' },
    hookMm: { min: 4.5, max: 5.5 },
    hookUs: '7 to I-9',
    notes: [],
  },
  {
    category: 4,
    name: 'Medium',
    typicalYarns: ['worsted', 'afghan', 'aran'],
    crochetGauge: { min: 11, max: 14, stitch: 'sc' },
    hookMm: { min: 5.5, max: 6.5 },
    hookUs: 'I-9 to K-10½',
    notes: [],
  },
  {
    category: 5,
    name: 'Bulky',
    typicalYarns: ['chunky', 'craft', 'rug'],
    crochetGauge: { min: 8, max: 11, stitch: 'sc' },
    hookMm: { min: 6.5, max: 9 },
    hookUs: 'K-10½ to M/N-13',
    notes: [],
  },
  {
    category: 6,
    name: 'Super Bulky',
    typicalYarns: ['super chunky', 'roving'],
    crochetGauge: { min: 6, max: 9, stitch: 'sc' },
    hookMm: { min: 9, max: 16 },
    hookUs: 'M/N-13 to Q',
    notes: [
      'Before 2015 the gauge range was 5–9 sc; it changed when category 7 was added.',
      'Some reprints give the hook range as 9–15 mm instead of 9–16 mm; unresolved.',
    ],
  },
  {
    category: 7,
    name: 'Jumbo',
    typicalYarns: ['jumbo', 'roving'],
    crochetGauge: { min: null, max: 5, stitch: 'sc' },
    hookMm: { min: 16, max: null },
    hookUs: 'Q and larger',
    notes: ['Added in 2015.'],
  },
];

/** The pre-2015 gauge of category 6, kept so an old label can still be read. */
export const CATEGORY_6_GAUGE_BEFORE_2015: Range = { min: 5, max: 9 };
/** The other hook range some reprints give for category 6 (the primary row keeps 16). */
export const CATEGORY_6_HOOK_MM_ALTERNATIVE: Range = { min: 9, max: 15 };

export function yarnWeight(category: number): YarnWeightRow {
  const row = YARN_WEIGHTS.find((r) => r.category === category);
  if (!row) throw new RangeError(`yarn weight must be a category from 0 to 7 (got ${category})`);
  return row;
}

/**
 * Regional names for the same yarns. No standard maps them onto the categories; these are the
 * usual equivalences makers use, so they are marked as such and shown as "about".
 */
export const REGIONAL_NAMES_SOURCE = 'common practice (no published source); the pairings are from memory';

export interface RegionalName {
  category: YarnWeightCategory;
  uk: string | null;
  au: string | null;
}

export const REGIONAL_YARN_NAMES: readonly RegionalName[] = [
  { category: 0, uk: '1-ply / 2-ply (lace)', au: '2-ply' },
  { category: 1, uk: '4-ply', au: '4-ply / 5-ply' },
  { category: 2, uk: 'sport / light DK', au: '5-ply' },
  { category: 3, uk: 'DK', au: '8-ply' },
  { category: 4, uk: 'aran', au: '10-ply' },
  { category: 5, uk: 'chunky', au: '12-ply' },
  { category: 6, uk: 'super chunky', au: '14-ply' },
  { category: 7, uk: 'jumbo', au: null },
];
