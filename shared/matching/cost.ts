import type { BlanketFields, SizeCategory } from '../schemas/blanket';
import type { GuidelineSet } from '../schemas/guidelines';
import { evaluate } from '../guidelines/check';
import { sizeCategoryRow } from '../guidelines/size-categories';

/**
 * What a (blanket, need) pair costs when the suggestion weighs it, in whole points, and the plain
 * reasons behind the figure. Lower is better. The weights are our own choice (no published source):
 * size counts most, because a blanket far from the size the unit asked for is the likeliest to sit
 * unused; then the maker's own pledge; then how soon the need is due; then stated colours or style.
 */

export const SIZE_WEIGHT = 40;
/** A blanket 150% off the target size costs no more than one 150% off: past that it is simply "far". */
export const SIZE_CAP = 1.5;
export const NOT_PLEDGED_HERE = 20;
export const URGENCY_WEIGHT = 20;
/** Needs due more than this many days ahead are all equally unhurried. */
export const URGENCY_HORIZON_DAYS = 90;
export const PREFERENCE_MISS = 10;
export const MAX_PAIR_COST = Math.round(SIZE_CAP * SIZE_WEIGHT) + NOT_PLEDGED_HERE + URGENCY_WEIGHT + PREFERENCE_MISS;

export interface MatchBlanket {
  id: number;
  code: string;
  /** The fields the guideline check reads, with the size on record (measured at intake where it was). */
  fields: BlanketFields;
  colours: string;
  bodyStitch: string;
  /** The need its maker pledged it for; null for "wherever needed most". */
  pledgedNeedId: number | null;
  siteId: number | null;
}

export interface MatchNeed {
  id: number;
  recipientId: number;
  recipientName: string;
  sizeCategory: SizeCategory;
  /** Slots still open: wanted minus already assigned. */
  open: number;
  deadline: string;
  preferences: string | null;
  guidelines: GuidelineSet;
}

export interface PairCost {
  cost: number;
  reasons: string[];
}

const DAY_MS = 86_400_000;

/** Whole days from `today` to an ISO day; negative once it has passed. */
export function daysUntil(deadline: string, today: Date): number {
  const due = Date.parse(`${deadline}T00:00:00Z`);
  const start = Date.UTC(today.getUTCFullYear(), today.getUTCMonth(), today.getUTCDate());
  return Math.round((due - start) / DAY_MS);
}

/** How far a size is from a category's nominal size: the relative gaps of both sides, added. */
export function sizeGap(widthCm: number, lengthCm: number, category: SizeCategory): number {
  const nominal = sizeCategoryRow(category).nominalCm;
  const short = Math.min(widthCm, lengthCm);
  const long = Math.max(widthCm, lengthCm);
  return Math.abs(short - nominal.width) / nominal.width + Math.abs(long - nominal.length) / nominal.length;
}

const NEGATIONS = new Set(['no', 'not', 'avoid', 'without', 'never']);
/** Words that carry a colour or style wish; the rest of a preference ("please", "colours") is padding. */
const WISH_WORDS = new Set([
  'pale', 'soft', 'bright', 'warm', 'calm', 'gentle', 'dark', 'light', 'muted', 'bold', 'neutral', 'pastel',
  'white', 'cream', 'grey', 'gray', 'black', 'navy', 'blue', 'green', 'red', 'pink', 'yellow', 'orange',
  'purple', 'lilac', 'lavender', 'peach', 'mint', 'teal', 'rust', 'brown', 'rainbow',
  'stripe', 'square', 'granny', 'plain', 'ripple', 'shell', 'textured',
]);

function words(text: string): string[] {
  return text
    .toLowerCase()
    .split(/[^a-z]+/)
    .filter(Boolean)
    .map((w) => (w === 'striped' ? 'stripe' : w.length > 4 && w.endsWith('s') ? w.slice(0, -1) : w));
}

/** The wished-for and the unwanted words of a need's preferences ("no very dark shades" → dark unwanted). */
export function readPreferences(preferences: string | null): { wanted: string[]; unwanted: string[] } {
  const ws = words(preferences ?? '');
  const wanted: string[] = [];
  const unwanted: string[] = [];
  ws.forEach((w, i) => {
    if (!WISH_WORDS.has(w)) return;
    const negated = ws.slice(Math.max(0, i - 3), i).some((x) => NEGATIONS.has(x));
    (negated ? unwanted : wanted).push(w);
  });
  return { wanted: [...new Set(wanted)], unwanted: [...new Set(unwanted)] };
}

/** Whether the need's recipient takes this blanket as it is, and the failing rules if not. */
export function feasibility(b: Pick<MatchBlanket, 'fields'>, g: GuidelineSet): { ok: boolean; reasons: string[] } {
  const reasons = evaluate(b.fields, g).reasons.map((r) => r.message);
  return { ok: reasons.length === 0, reasons };
}

// The same few preference texts and colour lists are read for every pair: read each once.
const prefCache = new Map<string, ReturnType<typeof readPreferences>>();
const ownCache = new Map<string, Set<string>>();
function remember<T>(cache: Map<string, T>, key: string, make: (k: string) => T): T {
  let v = cache.get(key);
  if (v === undefined) {
    if (cache.size > 10_000) cache.clear();
    cache.set(key, (v = make(key)));
  }
  return v;
}

const pct = (x: number) => `${Math.round(x * 100)}%`;

/**
 * The cost of a pair and, when `explain` is set, its reasons. The solver weighs every possible pair
 * but only the chosen ones are shown, so the words are written only for those.
 */
export function pairCost(b: MatchBlanket, n: MatchNeed, today: Date, explain = true): PairCost {
  const reasons: string[] = [];
  const say = (text: () => string) => {
    if (explain) reasons.push(text());
  };
  const { widthCm, lengthCm } = b.fields;
  const gap = sizeGap(widthCm, lengthCm, n.sizeCategory);
  const sizePts = Math.round(Math.min(gap, SIZE_CAP) * SIZE_WEIGHT);
  say(() => {
    const label = sizeCategoryRow(n.sizeCategory).label;
    const size = `${Math.round(widthCm)} × ${Math.round(lengthCm)} cm`;
    return gap <= 0.1 ? `${size} is close to the ${label} size asked for` : `${size} is ${pct(gap)} off the ${label} size, within the unit's limits`;
  });

  const pledgePts = b.pledgedNeedId === n.id ? 0 : NOT_PLEDGED_HERE;
  if (pledgePts === 0) say(() => 'Its maker pledged it for this need');
  else if (b.pledgedNeedId === null) say(() => 'Pledged for wherever it is needed most');

  const days = daysUntil(n.deadline, today);
  const urgencyPts = Math.round((Math.min(Math.max(days, 0), URGENCY_HORIZON_DAYS) / URGENCY_HORIZON_DAYS) * URGENCY_WEIGHT);
  say(() => (days < 0 ? `The need was due ${-days} days ago` : days <= 14 ? `The need is due soon (in ${days} days)` : `The need is due in ${days} days`));

  const prefs = remember(prefCache, n.preferences ?? '', readPreferences);
  const own = remember(ownCache, `${b.colours} ${b.bodyStitch}`, (t) => new Set(words(t)));
  const liked = prefs.wanted.filter((w) => own.has(w));
  const disliked = prefs.unwanted.filter((w) => own.has(w));
  let prefPts = 0;
  if (disliked.length > 0) {
    prefPts = PREFERENCE_MISS;
    say(() => `The unit asked for no ${disliked.join(' or ')}`);
  } else if (liked.length > 0) {
    say(() => `Matches the wish for ${liked.join(', ')}`);
  } else if (prefs.wanted.length > 0) {
    prefPts = PREFERENCE_MISS;
  }
  return { cost: sizePts + pledgePts + urgencyPts + prefPts, reasons };
}
